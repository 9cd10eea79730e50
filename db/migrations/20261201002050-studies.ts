import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * Trade-off studies. `inputs` is the full engine scenario plus the names of what it came from
 * (dish rows copied at creation); `result` is what the engine returned, stamped with
 * `engine_version`. Neither is ever rewritten: a re-run is a new row (revision), so a quote made
 * from an old study keeps its figures when the catalogue, the climate or the engine change.
 * The references are kept for navigation only and may go null if the source row is deleted.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('studies', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    customer_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'customers', key: 'id' }, onDelete: 'SET NULL' },
    site_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'sites', key: 'id' }, onDelete: 'SET NULL' },
    service_profile_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'service_profiles', key: 'id' }, onDelete: 'SET NULL' },
    climate_profile_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'climate_profiles', key: 'id' }, onDelete: 'SET NULL' },
    // The first study of a chain; re-runs point at it and count up `revision`.
    revision_of_study_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'studies', key: 'id' }, onDelete: 'SET NULL' },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    title: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.ENUM('ready', 'archived'), allowNull: false, defaultValue: 'ready' },
    // Denormalised at creation for the list (no JSON read per row): names as they were then.
    customer_name: { type: DataTypes.STRING(160), allowNull: false },
    site_name: { type: DataTypes.STRING(160), allowNull: false },
    service_name: { type: DataTypes.STRING(120), allowNull: false },
    recommended_diameter_m: { type: DataTypes.DECIMAL(5, 3), allowNull: true },
    dish_count: { type: DataTypes.INTEGER, allowNull: false },
    target_availability_percent: { type: DataTypes.DECIMAL(7, 4), allowNull: false },
    inputs: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('studies', ['company_id', 'created_at'], { name: 'studies_company_created' });
  await qi.addIndex('studies', ['company_id', 'site_id'], { name: 'studies_company_site' });
  await qi.addIndex('studies', ['revision_of_study_id'], { name: 'studies_revision_of' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('studies');
}
