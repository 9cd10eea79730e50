import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const money = (allowNull = false) => ({ type: DataTypes.DECIMAL(12, 2), allowNull, ...(allowNull ? {} : { defaultValue: '0.00' }) });

/**
 * Quotes made from one option of a study, their status history, and the comparison links that
 * show them to the customer.
 *
 * A quote copies what the customer is shown (every option's figures and catalogue price, the
 * chosen option, the site and service in words) into JSON at creation: the study, the catalogue
 * or the engine may change later, the quote never does. Money is DECIMAL(12,2), exact; totals
 * are computed with decimal.js (server/quotes/totals.ts) and stored so lists need no arithmetic.
 *
 * Comparison links store only sha256(token): the raw 32-byte token exists in the URL alone.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('quotes', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    // Per-company running number shown as "Q-0001"; unique with company_id.
    number: { type: DataTypes.INTEGER, allowNull: false },
    // Navigation only: the quote keeps its own snapshot, so a removed study leaves it intact.
    study_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'studies', key: 'id' }, onDelete: 'SET NULL' },
    status: { type: DataTypes.ENUM('draft', 'sent', 'viewed', 'accepted', 'declined', 'expired'), allowNull: false, defaultValue: 'draft' },
    title: { type: DataTypes.STRING(200), allowNull: false },
    customer_name: { type: DataTypes.STRING(160), allowNull: false },
    customer_email: { type: DataTypes.STRING(254), allowNull: true },
    site_name: { type: DataTypes.STRING(160), allowNull: false },
    service_name: { type: DataTypes.STRING(120), allowNull: false },
    chosen_option_index: { type: DataTypes.INTEGER, allowNull: false },
    recommended_option_index: { type: DataTypes.INTEGER, allowNull: true },
    chosen_option: { type: DataTypes.JSON, allowNull: false },
    options: { type: DataTypes.JSON, allowNull: false },
    // Site, service, climate source, warnings and engine version, as the study had them.
    study_snapshot: { type: DataTypes.JSON, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
    hardware_price: money(),
    labour_price: money(),
    extras_label: { type: DataTypes.STRING(120), allowNull: true },
    extras_price: money(),
    discount_amount: money(),
    tax_rate_percent: { type: DataTypes.DECIMAL(6, 3), allowNull: false, defaultValue: '0.000' },
    subtotal: money(),
    tax_amount: money(),
    total: money(),
    valid_until: { type: DataTypes.DATEONLY, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    first_viewed_at: { type: DataTypes.DATE, allowNull: true },
    decided_at: { type: DataTypes.DATE, allowNull: true },
    decided_by_name: { type: DataTypes.STRING(160), allowNull: true },
    decision_comment: { type: DataTypes.STRING(1000), allowNull: true },
    decision_ip: { type: DataTypes.STRING(64), allowNull: true },
    decision_user_agent: { type: DataTypes.STRING(255), allowNull: true },
    decision_link_id: { type: DataTypes.INTEGER, allowNull: true },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    sent_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('quotes', ['company_id', 'number'], { unique: true, name: 'quotes_company_number' });
  await qi.addIndex('quotes', ['company_id', 'created_at'], { name: 'quotes_company_created' });
  await qi.addIndex('quotes', ['company_id', 'status', 'valid_until'], { name: 'quotes_company_status_valid' });
  await qi.addIndex('quotes', ['study_id'], { name: 'quotes_study' });

  // What happened to a quote, in order: the status timeline and its audit trail.
  await qi.createTable('quote_events', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    quote_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'quotes', key: 'id' }, onDelete: 'CASCADE' },
    kind: {
      type: DataTypes.ENUM('created', 'updated', 'link_created', 'link_revoked', 'emailed', 'sent', 'viewed', 'accepted', 'declined', 'expired'),
      allowNull: false,
    },
    from_status: { type: DataTypes.STRING(20), allowNull: true },
    to_status: { type: DataTypes.STRING(20), allowNull: true },
    // A snapshot label ("Name <address>") survives the person leaving; null for the customer or the system.
    actor_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    actor_label: { type: DataTypes.STRING(400), allowNull: true },
    detail: { type: DataTypes.JSON, allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('quote_events', ['quote_id', 'id'], { name: 'quote_events_quote' });

  await qi.createTable('share_links', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    quote_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'quotes', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    revoked_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    view_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_viewed_at: { type: DataTypes.DATE, allowNull: true },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('share_links', ['quote_id'], { name: 'share_links_quote' });
  // Counting a company's active links for the plan limit.
  await qi.addIndex('share_links', ['company_id', 'revoked_at', 'expires_at'], { name: 'share_links_company_active' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('share_links');
  await qi.dropTable('quote_events');
  await qi.dropTable('quotes');
}
