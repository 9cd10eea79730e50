import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * The place a climate profile's figures were measured or made for (degrees, north and east
 * positive; null = not known). A study warns when its override profile was made more than
 * 100 km from the site, or for an unknown place.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('climate_profiles', 'lat_deg', { type: DataTypes.DECIMAL(8, 5), allowNull: true });
  await qi.addColumn('climate_profiles', 'lon_deg', { type: DataTypes.DECIMAL(9, 5), allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('climate_profiles', 'lon_deg');
  await qi.removeColumn('climate_profiles', 'lat_deg');
}
