import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import { decimalAttribute } from './decimal-column';

/** Where a site's altitude came from: typed in, or the ITU-R P.1511-1 topographic height at its coordinates. */
export const ALTITUDE_SOURCES = ['user', 'itu-r-p1511-1'] as const;
export type AltitudeSource = (typeof ALTITUDE_SOURCES)[number];

/** Where a dish goes: a customer's site, with coordinates as exact decimal strings (degrees, N/E positive). */
export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare customerId: number;
  declare name: string;
  declare address: string | null;
  declare latDeg: string;
  declare lonDeg: string;
  declare altitudeM: string;
  declare altitudeSource: CreationOptional<AltitudeSource>;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSite(sequelize: Sequelize): void {
  Site.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      customerId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      address: { type: DataTypes.STRING(300), allowNull: true },
      latDeg: decimalAttribute('latDeg', 9, 6, { allowNull: false }),
      lonDeg: decimalAttribute('lonDeg', 10, 6, { allowNull: false }),
      altitudeM: decimalAttribute('altitudeM', 7, 1, { allowNull: false }),
      altitudeSource: { type: DataTypes.ENUM(...ALTITUDE_SOURCES), allowNull: false, defaultValue: 'user' },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sites', underscored: true },
  );
}
