import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };

/**
 * Outbound webhooks of a company (settings/webhooks).
 *
 * - webhook_endpoints: the https URLs an admin registered, the events each wants, and the signing
 *   secret encrypted with WEBHOOK_SECRET_KEY from the environment (AES-256-GCM; signing needs the
 *   secret itself, so it cannot be a one-way hash). Removing an endpoint keeps nothing.
 * - webhook_deliveries: the outbox. A change that causes an event (a quote viewed or decided, a
 *   study created) inserts one row per subscribed endpoint in its own transaction, so a rolled
 *   back change sends nothing and a committed one is never lost. The deliverer claims due rows
 *   with SELECT … FOR UPDATE SKIP LOCKED and moves `next_attempt_at` ahead as its lease, so any
 *   number of app processes can deliver at once. The same rows are the delivery log.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('webhook_endpoints', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    url: { type: DataTypes.STRING(2000), allowNull: false },
    description: { type: DataTypes.STRING(80), allowNull: false },
    // Comma-separated event types (server/webhooks/events.ts).
    events: { type: DataTypes.STRING(200), allowNull: false },
    secret_ciphertext: { type: DataTypes.STRING(255), allowNull: false },
    // The secret's first characters, to tell endpoints apart in the list (never enough to sign).
    secret_hint: { type: DataTypes.STRING(16), allowNull: false },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('webhook_endpoints', ['company_id'], { name: 'webhook_endpoints_company' });

  await qi.createTable('webhook_deliveries', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    endpoint_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'webhook_endpoints', key: 'id' }, onDelete: 'CASCADE' },
    // The event's id (the same for every endpoint it went to): receivers de-duplicate on it.
    event_id: { type: DataTypes.STRING(40), allowNull: false },
    event_type: { type: DataTypes.STRING(40), allowNull: false },
    // The exact JSON body that is signed and sent on every attempt.
    body: { type: DataTypes.TEXT('medium'), allowNull: false },
    status: { type: DataTypes.ENUM('pending', 'delivered', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempt_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: true },
    last_attempt_at: { type: DataTypes.DATE(3), allowNull: true },
    last_response_code: { type: DataTypes.INTEGER, allowNull: true },
    last_error: { type: DataTypes.STRING(500), allowNull: true },
    delivered_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('webhook_deliveries', ['status', 'next_attempt_at'], { name: 'webhook_deliveries_due' });
  await qi.addIndex('webhook_deliveries', ['endpoint_id', 'id'], { name: 'webhook_deliveries_log' });
  await qi.addIndex('webhook_deliveries', ['endpoint_id', 'event_id'], { name: 'webhook_deliveries_once', unique: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('webhook_deliveries');
  await qi.dropTable('webhook_endpoints');
}
