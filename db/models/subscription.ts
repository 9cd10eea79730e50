import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** The provider's subscription statuses, as Stripe names them. */
export const SUBSCRIPTION_STATUSES = [
  'incomplete',
  'incomplete_expired',
  'trialing',
  'active',
  'past_due',
  'canceled',
  'unpaid',
  'paused',
] as const;
export type SubscriptionStatus = (typeof SUBSCRIPTION_STATUSES)[number];

/**
 * One provider subscription of a company, as the webhooks last reported it. Written only by
 * server/billing/apply-subscription.ts; limits read it through server/billing/limits.ts.
 */
export class Subscription extends Model<InferAttributes<Subscription>, InferCreationAttributes<Subscription>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare planId: number | null;
  declare providerSubscriptionId: string;
  declare providerCustomerId: string;
  declare providerPriceId: string | null;
  declare status: SubscriptionStatus;
  declare currentPeriodEnd: Date | null;
  declare cancelAtPeriodEnd: CreationOptional<boolean>;
  declare canceledAt: Date | null;
  declare endedAt: Date | null;
  declare pastDueSince: Date | null;
  declare graceEndsAt: Date | null;
  declare lastPaymentFailedAt: CreationOptional<Date | null>;
  declare pendingPlanId: CreationOptional<number | null>;
  /** Provider clock, unix seconds, of the newest event applied. */
  declare lastEventCreated: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSubscription(sequelize: Sequelize): void {
  Subscription.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      planId: { type: DataTypes.INTEGER, allowNull: true },
      providerSubscriptionId: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      providerCustomerId: { type: DataTypes.STRING(80), allowNull: false },
      providerPriceId: { type: DataTypes.STRING(80), allowNull: true },
      status: { type: DataTypes.ENUM(...SUBSCRIPTION_STATUSES), allowNull: false },
      currentPeriodEnd: { type: DataTypes.DATE, allowNull: true },
      cancelAtPeriodEnd: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      canceledAt: { type: DataTypes.DATE, allowNull: true },
      endedAt: { type: DataTypes.DATE, allowNull: true },
      pastDueSince: { type: DataTypes.DATE, allowNull: true },
      graceEndsAt: { type: DataTypes.DATE, allowNull: true },
      lastPaymentFailedAt: { type: DataTypes.DATE, allowNull: true },
      pendingPlanId: { type: DataTypes.INTEGER, allowNull: true },
      lastEventCreated: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'subscriptions', underscored: true },
  );
}
