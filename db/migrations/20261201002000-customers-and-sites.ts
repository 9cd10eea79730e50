import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** A company's customers and their sites (where a dish goes). Coordinates are exact decimals in degrees. */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('customers', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(160), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: true },
    phone: { type: DataTypes.STRING(40), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('customers', ['company_id', 'name'], { name: 'customers_company_name' });

  await qi.createTable('sites', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    customer_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'customers', key: 'id' }, onDelete: 'RESTRICT' },
    name: { type: DataTypes.STRING(160), allowNull: false },
    address: { type: DataTypes.STRING(300), allowNull: true },
    // Degrees, east/north positive; 6 decimals ≈ 0.1 m, far finer than pointing needs.
    lat_deg: { type: DataTypes.DECIMAL(9, 6), allowNull: false },
    lon_deg: { type: DataTypes.DECIMAL(10, 6), allowNull: false },
    altitude_m: { type: DataTypes.DECIMAL(7, 1), allowNull: false, defaultValue: '0.0' },
    notes: { type: DataTypes.TEXT, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('sites', ['company_id', 'customer_id'], { name: 'sites_company_customer' });
  await qi.addIndex('sites', ['company_id', 'name'], { name: 'sites_company_name' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('sites');
  await qi.dropTable('customers');
}
