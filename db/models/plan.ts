import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** A subscription plan and its limits. Limits are read through server/billing/limits (one function). */
export class Plan extends Model<InferAttributes<Plan>, InferCreationAttributes<Plan>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare description: string | null;
  /** Exact decimal string, e.g. "49.00"; handle with decimal.js. */
  declare monthlyPriceUsd: CreationOptional<string>;
  declare seatLimit: number;
  declare studiesPerMonth: number;
  declare activeLinksLimit: number;
  declare uploadsPerMonth: number;
  /** Sites one upgrade campaign may hold (a per-campaign cap, not a monthly count). */
  declare campaignSitesLimit: CreationOptional<number>;
  declare apiAccess: CreationOptional<boolean>;
  declare quoteBranding: CreationOptional<boolean>;
  declare kind: CreationOptional<'trial' | 'free' | 'paid'>;
  declare trialDays: number | null;
  declare isPublic: CreationOptional<boolean>;
  declare sortOrder: CreationOptional<number>;
  declare stripeProductId: string | null;
  declare stripePriceId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initPlan(sequelize: Sequelize): void {
  Plan.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(80), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: true },
      monthlyPriceUsd: { type: DataTypes.DECIMAL(10, 2), allowNull: false, defaultValue: '0.00' },
      seatLimit: { type: DataTypes.INTEGER, allowNull: false },
      studiesPerMonth: { type: DataTypes.INTEGER, allowNull: false },
      activeLinksLimit: { type: DataTypes.INTEGER, allowNull: false },
      uploadsPerMonth: { type: DataTypes.INTEGER, allowNull: false },
      campaignSitesLimit: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5000 },
      apiAccess: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      quoteBranding: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      kind: { type: DataTypes.ENUM('trial', 'free', 'paid'), allowNull: false, defaultValue: 'paid' },
      trialDays: { type: DataTypes.INTEGER, allowNull: true },
      isPublic: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      stripeProductId: { type: DataTypes.STRING(80), allowNull: true },
      stripePriceId: { type: DataTypes.STRING(80), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'plans', underscored: true },
  );
}
