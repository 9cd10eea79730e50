import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

/**
 * Sign-in limits that slow an attacker without locking out the account's owner.
 *
 * - sign_in_attempts.client: sha256 of the client an attempt came from (the IP behind a trusted
 *   proxy, else the browser's own random client cookie), so wrong passwords lock that address on
 *   that client only; `trusted` marks attempts from a browser the owner has already signed in
 *   from (or unlocked by mail), which the per-address, per-IP and global limits leave out.
 * - sign_in_trusted_clients: the browsers (sha256 of their client cookie) that may sign in to an
 *   address whatever strangers do to it.
 * - sign_in_unlock_tokens: the mailed "sign in from this browser" links (sha256 only, single use).
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('sign_in_attempts', 'client', { type: DataTypes.CHAR(64), allowNull: true });
  await qi.addColumn('sign_in_attempts', 'trusted', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  // The global budget counts untrusted failures of every address in a window.
  await qi.addIndex('sign_in_attempts', ['kind', 'trusted', 'succeeded', 'created_at'], { name: 'sign_in_attempts_global' });

  await qi.createTable('sign_in_trusted_clients', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    client_hash: { type: DataTypes.CHAR(64), allowNull: false },
    created_at: now,
    last_used_at: now,
  });
  await qi.addIndex('sign_in_trusted_clients', ['email', 'client_hash'], { name: 'sign_in_trusted_clients_pair', unique: true });

  await qi.createTable('sign_in_unlock_tokens', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await qi.addIndex('sign_in_unlock_tokens', ['user_id', 'created_at'], { name: 'sign_in_unlock_tokens_user' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('sign_in_unlock_tokens');
  await qi.dropTable('sign_in_trusted_clients');
  await qi.removeIndex('sign_in_attempts', 'sign_in_attempts_global');
  await qi.removeColumn('sign_in_attempts', 'trusted');
  await qi.removeColumn('sign_in_attempts', 'client');
}
