import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * Uploaded CSV files, kept byte for byte with the parse report that accepted them, so a catalogue
 * or climate profile can always be traced back to the file it came from.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('uploads', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('dish-catalogue', 'rain-curve', 'climate-normals'), allowNull: false },
    original_filename: { type: DataTypes.STRING(255), allowNull: false },
    original_bytes: { type: DataTypes.BLOB('medium'), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    parse_report: { type: DataTypes.JSON, allowNull: false },
    status: { type: DataTypes.ENUM('applied'), allowNull: false, defaultValue: 'applied' },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('uploads', ['company_id', 'created_at'], { name: 'uploads_company_created' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('uploads');
}
