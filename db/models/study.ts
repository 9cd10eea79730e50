import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import { decimalAttribute } from './decimal-column';

export const STUDY_STATUSES = ['ready', 'archived'] as const;
export type StudyStatus = (typeof STUDY_STATUSES)[number];

/**
 * A saved trade-off study. `inputs` and `result` are snapshots (server/studies/snapshot.ts gives
 * their types) and are never updated after creation; a re-run is a new row.
 */
export class Study extends Model<InferAttributes<Study>, InferCreationAttributes<Study>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare customerId: number | null;
  declare siteId: number | null;
  declare serviceProfileId: number | null;
  declare climateProfileId: number | null;
  declare revisionOfStudyId: number | null;
  declare revision: CreationOptional<number>;
  /** Set on every service of a comparison but the first: the id of the first service's (leading) row. */
  declare comparisonOfStudyId: CreationOptional<number | null>;
  declare title: string;
  declare status: CreationOptional<StudyStatus>;
  declare customerName: string;
  declare siteName: string;
  declare serviceName: string;
  declare recommendedDiameterM: string | null;
  declare dishCount: number;
  declare targetAvailabilityPercent: string;
  declare inputs: unknown;
  declare result: unknown;
  declare engineVersion: string;
  declare createdByUserId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initStudy(sequelize: Sequelize): void {
  Study.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      customerId: { type: DataTypes.INTEGER, allowNull: true },
      siteId: { type: DataTypes.INTEGER, allowNull: true },
      serviceProfileId: { type: DataTypes.INTEGER, allowNull: true },
      climateProfileId: { type: DataTypes.INTEGER, allowNull: true },
      revisionOfStudyId: { type: DataTypes.INTEGER, allowNull: true },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      comparisonOfStudyId: { type: DataTypes.INTEGER, allowNull: true },
      title: { type: DataTypes.STRING(200), allowNull: false },
      status: { type: DataTypes.ENUM(...STUDY_STATUSES), allowNull: false, defaultValue: 'ready' },
      customerName: { type: DataTypes.STRING(160), allowNull: false },
      siteName: { type: DataTypes.STRING(160), allowNull: false },
      serviceName: { type: DataTypes.STRING(120), allowNull: false },
      recommendedDiameterM: decimalAttribute('recommendedDiameterM', 5, 3, { allowNull: true }),
      dishCount: { type: DataTypes.INTEGER, allowNull: false },
      targetAvailabilityPercent: decimalAttribute('targetAvailabilityPercent', 7, 4, { allowNull: false }),
      inputs: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: false },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'studies', underscored: true },
  );
}
