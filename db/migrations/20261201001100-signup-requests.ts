import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

/**
 * Pending sign-ups: nothing is created until the person opens the link mailed to the address,
 * so the form answers alike whether or not the address already has an account. Only the
 * sha256 digest of the link's token and the argon2 hash of the chosen password are kept.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('signup_requests', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    company_name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    requested_ip: { type: DataTypes.STRING(64), allowNull: true },
    created_at: now,
  });
  await qi.addIndex('signup_requests', ['email'], { name: 'signup_requests_email' });
  await qi.addIndex('signup_requests', ['expires_at'], { name: 'signup_requests_expires' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('signup_requests');
}
