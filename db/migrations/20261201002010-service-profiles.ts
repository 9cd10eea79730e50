import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** A satellite service as the company sells it: the carrier a dish has to receive (and, for VSAT, send). */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('service_profiles', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    satellite_name: { type: DataTypes.STRING(120), allowNull: false },
    satellite_longitude_deg: { type: DataTypes.DECIMAL(6, 2), allowNull: false },
    downlink_frequency_ghz: { type: DataTypes.DECIMAL(8, 4), allowNull: false },
    polarization: { type: DataTypes.ENUM('linear-horizontal', 'linear-vertical', 'circular'), allowNull: false },
    // Extra tilt of the linear polarization plane at the satellite, added to the geometric skew.
    polarization_tilt_deg: { type: DataTypes.DECIMAL(5, 2), allowNull: false, defaultValue: '0.00' },
    eirp_dbw: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    symbol_rate_msps: { type: DataTypes.DECIMAL(9, 4), allowNull: false },
    modcod: { type: DataTypes.STRING(20), allowNull: true },
    required_es_n0_db: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    implementation_margin_db: { type: DataTypes.DECIMAL(4, 2), allowNull: false, defaultValue: '0.00' },
    other_losses_db: { type: DataTypes.DECIMAL(4, 2), allowNull: false, defaultValue: '0.00' },
    lnb_noise_temp_k: { type: DataTypes.DECIMAL(6, 1), allowNull: false },
    antenna_noise_temp_k: { type: DataTypes.DECIMAL(6, 1), allowNull: false },
    // { frequencyGHz, eirpDbw, satelliteGOverTDbK, symbolRateMsps, requiredEsN0Db, implementationMarginDb } or null.
    uplink: { type: DataTypes.JSON, allowNull: true },
    // MODCOD names of the ACM set, e.g. ["QPSK 1/2","QPSK 3/4","8PSK 2/3"], or null for a fixed carrier.
    acm_modcods: { type: DataTypes.JSON, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('service_profiles', ['company_id', 'name'], { name: 'service_profiles_company_name' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('service_profiles');
}
