import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamp = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

const SUBSCRIPTION_STATUSES_AT_MIGRATION = [
  'incomplete',
  'incomplete_expired',
  'trialing',
  'active',
  'past_due',
  'canceled',
  'unpaid',
  'paused',
] as const;

/**
 * Billing: the payment provider's customer on each company, provider sync state on plans,
 * subscriptions (one row per provider subscription), checkouts started from the app, and every
 * webhook event received (unique by provider event id, so each is applied once).
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('companies', 'stripe_customer_id', { type: DataTypes.STRING(80), allowNull: true });
  await qi.addIndex('companies', ['stripe_customer_id'], { unique: true, name: 'companies_stripe_customer' });

  // When the plan was last pushed to the provider, and why the last push failed (shown to staff).
  await qi.addColumn('plans', 'provider_synced_at', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('plans', 'provider_sync_error', { type: DataTypes.STRING(500), allowNull: true });

  await qi.createTable('subscriptions', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    // Null only while the provider's price matches no plan of ours (logged on the webhook event).
    plan_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    provider_subscription_id: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    provider_customer_id: { type: DataTypes.STRING(80), allowNull: false },
    provider_price_id: { type: DataTypes.STRING(80), allowNull: true },
    status: { type: DataTypes.ENUM(...SUBSCRIPTION_STATUSES_AT_MIGRATION), allowNull: false },
    current_period_end: { type: DataTypes.DATE, allowNull: true },
    cancel_at_period_end: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    canceled_at: { type: DataTypes.DATE, allowNull: true },
    ended_at: { type: DataTypes.DATE, allowNull: true },
    // Set when the subscription first goes past_due/unpaid; cleared when it is paid again.
    past_due_since: { type: DataTypes.DATE, allowNull: true },
    grace_ends_at: { type: DataTypes.DATE, allowNull: true },
    last_payment_failed_at: { type: DataTypes.DATE, allowNull: true },
    // A plan change the admin asked for that the provider has not confirmed yet.
    pending_plan_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'plans', key: 'id' }, onDelete: 'SET NULL' },
    // Provider's `created` (unix seconds) of the newest event applied: older events are stale.
    last_event_created: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    created_at: stamp,
    updated_at: stamp,
  });
  await qi.addIndex('subscriptions', ['company_id', 'status'], { name: 'subscriptions_company_status' });

  await qi.createTable('billing_checkouts', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    plan_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    provider_session_id: { type: DataTypes.STRING(255), allowNull: false, unique: true },
    provider_subscription_id: { type: DataTypes.STRING(80), allowNull: true },
    status: { type: DataTypes.ENUM('open', 'completed', 'expired'), allowNull: false, defaultValue: 'open' },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    completed_at: { type: DataTypes.DATE, allowNull: true },
    created_at: stamp,
    updated_at: stamp,
  });
  await qi.addIndex('billing_checkouts', ['company_id', 'created_at'], { name: 'billing_checkouts_company' });

  await qi.createTable('webhook_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    provider_event_id: { type: DataTypes.STRING(255), allowNull: false, unique: true },
    type: { type: DataTypes.STRING(100), allowNull: false },
    // The provider's `created` (unix seconds); ordering uses this, not our receipt time.
    event_created: { type: DataTypes.BIGINT, allowNull: false },
    delivery_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    // What applying it did: applied, stale, unmatched_company, unknown_plan…
    outcome: { type: DataTypes.STRING(40), allowNull: true },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    payload: { type: DataTypes.JSON, allowNull: false },
    received_at: stamp,
    processed_at: { type: DataTypes.DATE, allowNull: true },
    updated_at: stamp,
  });
  await qi.addIndex('webhook_events', ['type', 'received_at'], { name: 'webhook_events_type' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('webhook_events');
  await qi.dropTable('billing_checkouts');
  await qi.dropTable('subscriptions');
  await qi.removeColumn('plans', 'provider_sync_error');
  await qi.removeColumn('plans', 'provider_synced_at');
  await qi.removeIndex('companies', 'companies_stripe_customer');
  await qi.removeColumn('companies', 'stripe_customer_id');
}
