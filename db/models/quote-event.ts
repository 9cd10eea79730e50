import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const QUOTE_EVENT_KINDS = ['created', 'updated', 'link_created', 'link_revoked', 'emailed', 'sent', 'viewed', 'accepted', 'declined', 'expired'] as const;
export type QuoteEventKind = (typeof QUOTE_EVENT_KINDS)[number];

/** One step in a quote's life (its status timeline and audit trail); never updated. */
export class QuoteEvent extends Model<InferAttributes<QuoteEvent>, InferCreationAttributes<QuoteEvent>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare quoteId: number;
  declare kind: QuoteEventKind;
  declare fromStatus: string | null;
  declare toStatus: string | null;
  declare actorUserId: string | null;
  declare actorLabel: string | null;
  declare detail: Record<string, unknown> | null;
  declare ip: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initQuoteEvent(sequelize: Sequelize): void {
  QuoteEvent.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      quoteId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM(...QUOTE_EVENT_KINDS), allowNull: false },
      fromStatus: { type: DataTypes.STRING(20), allowNull: true },
      toStatus: { type: DataTypes.STRING(20), allowNull: true },
      actorUserId: { type: DataTypes.STRING(40), allowNull: true },
      actorLabel: { type: DataTypes.STRING(400), allowNull: true },
      detail: { type: DataTypes.JSON, allowNull: true },
      ip: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'quote_events', underscored: true, updatedAt: false },
  );
}
