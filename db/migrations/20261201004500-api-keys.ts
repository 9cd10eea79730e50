import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

/**
 * API keys of a company (integrators call /api/v1 with `Authorization: Bearer …`) and their
 * per-minute request counters. Only the sha256 of a key is stored, beside a short prefix that
 * identifies it in lists and is the lookup column (the hash is then compared in constant time).
 * The counters live here, not in a process, so every app server counts the same window.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('api_keys', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(80), allowNull: false },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    // Comma-separated API scopes (server/auth/api-scopes.ts), checked on every read.
    scopes: { type: DataTypes.STRING(100), allowNull: false },
    rate_limit_per_minute: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 120 },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    last_used_ip: { type: DataTypes.STRING(64), allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    revoked_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('api_keys', ['prefix'], { name: 'api_keys_prefix' });
  await qi.addIndex('api_keys', ['company_id', 'revoked_at'], { name: 'api_keys_company' });

  // One row per key per fixed one-minute window; the request counter is raised by an atomic upsert.
  await qi.createTable('api_key_rate_windows', {
    api_key_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'api_keys', key: 'id' }, onDelete: 'CASCADE' },
    window_start: { type: DataTypes.DATE, allowNull: false, primaryKey: true },
    request_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('api_key_rate_windows');
  await qi.dropTable('api_keys');
}
