import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * The company's logo for quotes (PDF and the customer's page): a small PNG or JPEG, at most
 * 200 KiB (server/quotes/logo-image.ts), kept in MariaDB so every app server can serve it.
 * MEDIUMBLOB because BLOB stops at 64 KiB.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('companies', 'logo_mime', { type: DataTypes.STRING(20), allowNull: true });
  await qi.addColumn('companies', 'logo_data', { type: 'MEDIUMBLOB', allowNull: true });
  await qi.addColumn('companies', 'logo_width', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('companies', 'logo_height', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('companies', 'logo_updated_at', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('companies', 'logo_updated_at');
  await qi.removeColumn('companies', 'logo_height');
  await qi.removeColumn('companies', 'logo_width');
  await qi.removeColumn('companies', 'logo_data');
  await qi.removeColumn('companies', 'logo_mime');
}
