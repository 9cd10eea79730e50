import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import { decimalAttribute } from './decimal-column';

export const POLARIZATIONS = ['linear-horizontal', 'linear-vertical', 'circular'] as const;
export type Polarization = (typeof POLARIZATIONS)[number];

/** Optional return link of a two-way (VSAT) service: the terminal transmits to the satellite. */
export interface ServiceUplink {
  frequencyGHz: number;
  /** Fixed terminal EIRP, dBW — or, instead, the HPA (BUC) power, so EIRP grows with the dish gain. */
  terminalEirpDbw?: number;
  hpaPowerW?: number;
  satelliteGOverTDbK: number;
  symbolRateMsps: number;
  requiredEsN0Db: number;
  implementationMarginDb: number;
}

/** A satellite service as the company sells it; decimals are exact strings as stored. */
export class ServiceProfile extends Model<InferAttributes<ServiceProfile>, InferCreationAttributes<ServiceProfile>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare satelliteName: string;
  declare satelliteLongitudeDeg: string;
  declare downlinkFrequencyGhz: string;
  declare polarization: Polarization;
  declare polarizationTiltDeg: CreationOptional<string>;
  declare eirpDbw: string;
  declare symbolRateMsps: string;
  declare modcod: string | null;
  declare requiredEsN0Db: string;
  declare implementationMarginDb: CreationOptional<string>;
  declare otherLossesDb: CreationOptional<string>;
  declare lnbNoiseTempK: string;
  declare antennaNoiseTempK: string;
  declare uplink: ServiceUplink | null;
  declare acmModcods: string[] | null;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initServiceProfile(sequelize: Sequelize): void {
  ServiceProfile.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      satelliteName: { type: DataTypes.STRING(120), allowNull: false },
      satelliteLongitudeDeg: decimalAttribute('satelliteLongitudeDeg', 6, 2, { allowNull: false }),
      downlinkFrequencyGhz: decimalAttribute('downlinkFrequencyGhz', 8, 4, { allowNull: false }),
      polarization: { type: DataTypes.ENUM(...POLARIZATIONS), allowNull: false },
      polarizationTiltDeg: decimalAttribute('polarizationTiltDeg', 5, 2, { allowNull: false, defaultValue: '0.00' }),
      eirpDbw: decimalAttribute('eirpDbw', 5, 2, { allowNull: false }),
      symbolRateMsps: decimalAttribute('symbolRateMsps', 9, 4, { allowNull: false }),
      modcod: { type: DataTypes.STRING(20), allowNull: true },
      requiredEsN0Db: decimalAttribute('requiredEsN0Db', 5, 2, { allowNull: false }),
      implementationMarginDb: decimalAttribute('implementationMarginDb', 4, 2, { allowNull: false, defaultValue: '0.00' }),
      otherLossesDb: decimalAttribute('otherLossesDb', 4, 2, { allowNull: false, defaultValue: '0.00' }),
      lnbNoiseTempK: decimalAttribute('lnbNoiseTempK', 6, 1, { allowNull: false }),
      antennaNoiseTempK: decimalAttribute('antennaNoiseTempK', 6, 1, { allowNull: false }),
      uplink: { type: DataTypes.JSON, allowNull: true },
      acmModcods: { type: DataTypes.JSON, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'service_profiles', underscored: true },
  );
}
