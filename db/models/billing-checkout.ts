import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const CHECKOUT_STATUSES = ['open', 'completed', 'expired'] as const;
export type CheckoutStatus = (typeof CHECKOUT_STATUSES)[number];

/**
 * A hosted checkout the app opened for a company. The return page finds it by the provider's
 * session id (and the company), so it can wait for the webhook that completes it.
 */
export class BillingCheckout extends Model<InferAttributes<BillingCheckout>, InferCreationAttributes<BillingCheckout>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare planId: number;
  declare providerSessionId: string;
  declare providerSubscriptionId: CreationOptional<string | null>;
  declare status: CreationOptional<CheckoutStatus>;
  declare createdByUserId: string | null;
  declare expiresAt: Date;
  declare completedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initBillingCheckout(sequelize: Sequelize): void {
  BillingCheckout.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      planId: { type: DataTypes.INTEGER, allowNull: false },
      providerSessionId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
      providerSubscriptionId: { type: DataTypes.STRING(80), allowNull: true },
      status: { type: DataTypes.ENUM(...CHECKOUT_STATUSES), allowNull: false, defaultValue: 'open' },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      completedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'billing_checkouts', underscored: true },
  );
}
