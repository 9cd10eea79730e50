import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * How the company's customers reach it, set on the branding page: shown on the customer's page and
 * the PDF, the Reply-To of quote e-mails when set, and the sales contact told of decisions.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('companies', 'contact_email', { type: DataTypes.STRING(254), allowNull: true });
  await qi.addColumn('companies', 'contact_phone', { type: DataTypes.STRING(40), allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('companies', 'contact_phone');
  await qi.removeColumn('companies', 'contact_email');
}
