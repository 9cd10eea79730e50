import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

/**
 * Invitations, password-reset tokens, sign-in throttling and the audit log.
 * Tokens are stored only as sha256 hex digests: a copy of the database opens no account.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('invitations', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'installer', 'sales'), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    invited_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    last_sent_at: { type: DataTypes.DATE, allowNull: false },
    send_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('invitations', ['company_id', 'email'], { name: 'invitations_company_email' });

  await qi.createTable('password_reset_tokens', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    requested_ip: { type: DataTypes.STRING(64), allowNull: true },
    created_at: now,
  });
  await qi.addIndex('password_reset_tokens', ['user_id'], { name: 'password_reset_tokens_user' });

  // One row per attempt; throttles count recent failures by address and by IP.
  await qi.createTable('sign_in_attempts', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    kind: { type: DataTypes.ENUM('sign_in', 'reset_request', 'sign_up'), allowNull: false, defaultValue: 'sign_in' },
    email: { type: DataTypes.STRING(254), allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
  });
  await qi.addIndex('sign_in_attempts', ['kind', 'email', 'created_at'], { name: 'sign_in_attempts_email' });
  await qi.addIndex('sign_in_attempts', ['kind', 'ip', 'created_at'], { name: 'sign_in_attempts_ip' });
  await qi.addIndex('sign_in_attempts', ['created_at'], { name: 'sign_in_attempts_created' });

  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    // Null for a person's own security events (sign-in failures, password resets); admins of
    // every company the person belongs to see those through subject_user_id.
    company_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    actor_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    // Snapshot of who acted, so the log still reads after the person is deleted.
    actor_label: { type: DataTypes.STRING(300), allowNull: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    subject_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    target_label: { type: DataTypes.STRING(300), allowNull: true },
    detail: { type: DataTypes.TEXT, allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    user_agent: { type: DataTypes.STRING(255), allowNull: true },
    created_at: now,
  });
  await qi.addIndex('audit_events', ['company_id', 'created_at'], { name: 'audit_events_company' });
  await qi.addIndex('audit_events', ['subject_user_id', 'created_at'], { name: 'audit_events_subject' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('audit_events');
  await qi.dropTable('sign_in_attempts');
  await qi.dropTable('password_reset_tokens');
  await qi.dropTable('invitations');
}
