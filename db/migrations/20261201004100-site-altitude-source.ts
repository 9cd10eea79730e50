import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * Where a site's altitude came from: typed in by the user, or (when the box was left blank) the
 * ITU-R P.1511-1 topographic height at the site's coordinates. Existing sites were all typed in.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('sites', 'altitude_source', { type: DataTypes.ENUM('user', 'itu-r-p1511-1'), allowNull: false, defaultValue: 'user' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('sites', 'altitude_source');
}
