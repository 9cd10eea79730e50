import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** Plans, companies, people, memberships (role per company) and lucia sessions. */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('plans', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(80), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    monthly_price_usd: { type: DataTypes.DECIMAL(10, 2), allowNull: false, defaultValue: '0.00' },
    seat_limit: { type: DataTypes.INTEGER, allowNull: false },
    studies_per_month: { type: DataTypes.INTEGER, allowNull: false },
    active_links_limit: { type: DataTypes.INTEGER, allowNull: false },
    uploads_per_month: { type: DataTypes.INTEGER, allowNull: false },
    api_access: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    quote_branding: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    kind: { type: DataTypes.ENUM('trial', 'free', 'paid'), allowNull: false, defaultValue: 'paid' },
    trial_days: { type: DataTypes.INTEGER, allowNull: true },
    is_public: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    sort_order: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    stripe_product_id: { type: DataTypes.STRING(80), allowNull: true },
    stripe_price_id: { type: DataTypes.STRING(80), allowNull: true },
    ...stamps,
  });

  await qi.createTable('companies', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    plan_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    trial_ends_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });

  await qi.createTable('users', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    is_staff: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...stamps,
  });

  await qi.createTable('memberships', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: DataTypes.ENUM('admin', 'installer', 'sales'), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('memberships', ['company_id', 'user_id'], { unique: true, name: 'memberships_company_user' });

  await qi.createTable('sessions', {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    user_id: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    active_company_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'companies', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    user_agent: { type: DataTypes.STRING(255), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('sessions', ['user_id'], { name: 'sessions_user' });
  await qi.addIndex('sessions', ['expires_at'], { name: 'sessions_expires' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('sessions');
  await qi.dropTable('memberships');
  await qi.dropTable('users');
  await qi.dropTable('companies');
  await qi.dropTable('plans');
}
