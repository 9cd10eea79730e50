import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/**
 * Rain climates the company keeps for its area (server/engine/README.md §1): monthly normals (ITU-R P.837-7
 * Annex 1), a measured exceedance curve, a known R0.01, or a legacy P.837-1 zone.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('climate_profiles', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.ENUM('monthly-normals', 'measured-curve', 'known-r001', 'climate-zone'), allowNull: false },
    data: { type: DataTypes.JSON, allowNull: false },
    // 0 °C isotherm height above mean sea level (ITU-R P.839-4 h0); null → the labelled latitude approximation.
    zero_isotherm_km: { type: DataTypes.DECIMAL(5, 3), allowNull: true },
    source_note: { type: DataTypes.STRING(500), allowNull: false },
    upload_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'uploads', key: 'id' }, onDelete: 'SET NULL' },
    ...stamps,
  });
  await qi.addIndex('climate_profiles', ['company_id', 'name'], { name: 'climate_profiles_company_name' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('climate_profiles');
}
