import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** The company's dish catalogue and price list. Prices are exact decimals in the company's currency (USD). */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('dishes', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    diameter_m: { type: DataTypes.DECIMAL(5, 3), allowNull: false },
    efficiency: { type: DataTypes.DECIMAL(4, 3), allowNull: false },
    hardware_price: { type: DataTypes.DECIMAL(10, 2), allowNull: false },
    labour_price: { type: DataTypes.DECIMAL(10, 2), allowNull: false },
    mount_notes: { type: DataTypes.TEXT, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...stamps,
  });
  await qi.addIndex('dishes', ['company_id', 'name'], { unique: true, name: 'dishes_company_name' });
  await qi.addIndex('dishes', ['company_id', 'diameter_m'], { name: 'dishes_company_diameter' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('dishes');
}
