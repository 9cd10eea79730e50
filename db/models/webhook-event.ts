import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/**
 * A webhook event as received from the payment provider. The unique provider event id is what
 * makes a redelivery a no-op; `processedAt` is set in the same transaction as the event's effect.
 */
export class WebhookEvent extends Model<InferAttributes<WebhookEvent>, InferCreationAttributes<WebhookEvent>> {
  declare id: CreationOptional<number>;
  declare providerEventId: string;
  declare type: string;
  declare eventCreated: number;
  declare deliveryCount: CreationOptional<number>;
  declare outcome: CreationOptional<string | null>;
  declare lastError: CreationOptional<string | null>;
  declare payload: unknown;
  declare receivedAt: CreationOptional<Date>;
  declare processedAt: CreationOptional<Date | null>;
  declare updatedAt: CreationOptional<Date>;
}

export function initWebhookEvent(sequelize: Sequelize): void {
  WebhookEvent.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      providerEventId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
      type: { type: DataTypes.STRING(100), allowNull: false },
      eventCreated: { type: DataTypes.BIGINT, allowNull: false },
      deliveryCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      outcome: { type: DataTypes.STRING(40), allowNull: true },
      lastError: { type: DataTypes.STRING(1000), allowNull: true },
      payload: { type: DataTypes.JSON, allowNull: false },
      receivedAt: DataTypes.DATE,
      processedAt: { type: DataTypes.DATE, allowNull: true },
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'webhook_events', underscored: true, createdAt: 'receivedAt' },
  );
}
