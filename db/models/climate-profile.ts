import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import { decimalAttribute } from './decimal-column';

export const CLIMATE_KINDS = ['monthly-normals', 'measured-curve', 'known-r001', 'climate-zone'] as const;
export type ClimateKind = (typeof CLIMATE_KINDS)[number];

/** The data of each kind of rain climate (server/engine/README.md §1); validated by server/validation/climate.ts. */
export type ClimateData =
  | { monthlyRainfallMm: number[]; monthlyTemperatureC: number[] }
  | { points: { pPercent: number; rainRateMmH: number }[] }
  | { r001MmH: number }
  | { zone: string };

/** A rain climate the company keeps for its area, with where the figures came from. */
export class ClimateProfile extends Model<InferAttributes<ClimateProfile>, InferCreationAttributes<ClimateProfile>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare kind: ClimateKind;
  declare data: ClimateData;
  declare zeroIsothermKm: string | null;
  declare sourceNote: string;
  /** Where the figures were measured or made for (exact decimal strings); null = not known. */
  declare latDeg: CreationOptional<string | null>;
  declare lonDeg: CreationOptional<string | null>;
  declare uploadId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initClimateProfile(sequelize: Sequelize): void {
  ClimateProfile.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      kind: { type: DataTypes.ENUM(...CLIMATE_KINDS), allowNull: false },
      data: { type: DataTypes.JSON, allowNull: false },
      zeroIsothermKm: decimalAttribute('zeroIsothermKm', 5, 3, { allowNull: true }),
      sourceNote: { type: DataTypes.STRING(500), allowNull: false },
      latDeg: decimalAttribute('latDeg', 8, 5, { allowNull: true }),
      lonDeg: decimalAttribute('lonDeg', 9, 5, { allowNull: true }),
      uploadId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'climate_profiles', underscored: true },
  );
}
