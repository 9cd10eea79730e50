import Decimal from 'decimal.js';
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { QuoteOptionSnapshot, QuoteStudySnapshot } from '@/server/quotes/snapshot';
import { QUOTE_STATUSES, type QuoteStatus } from '@/server/quotes/status';

/**
 * A quote made from one option of a study. Options, chosen option and study summary are
 * snapshots written at creation and never rewritten; money columns are exact decimal strings.
 */
export class Quote extends Model<InferAttributes<Quote>, InferCreationAttributes<Quote>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare number: number;
  declare studyId: number | null;
  declare status: CreationOptional<QuoteStatus>;
  declare title: string;
  declare customerName: string;
  declare customerEmail: string | null;
  declare siteName: string;
  declare serviceName: string;
  declare chosenOptionIndex: number;
  declare recommendedOptionIndex: number | null;
  declare chosenOption: QuoteOptionSnapshot;
  declare options: QuoteOptionSnapshot[];
  declare studySnapshot: QuoteStudySnapshot;
  declare currency: CreationOptional<string>;
  declare hardwarePrice: string;
  declare labourPrice: string;
  declare extrasLabel: string | null;
  declare extrasPrice: string;
  declare discountAmount: string;
  declare taxRatePercent: string;
  declare subtotal: string;
  declare taxAmount: string;
  declare total: string;
  declare validUntil: string;
  declare notes: string | null;
  declare sentAt: Date | null;
  declare firstViewedAt: Date | null;
  declare decidedAt: Date | null;
  declare decidedByName: string | null;
  declare decisionComment: string | null;
  declare decisionIp: string | null;
  declare decisionUserAgent: string | null;
  declare decisionLinkId: number | null;
  declare createdByUserId: string | null;
  declare sentByUserId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/**
 * The mariadb connector (with Sequelize's supportBigNumbers) hands back a DECIMAL whose fraction
 * is zero as a JS number (189) and others as strings ('189.50'); these getters always give the
 * canonical decimal string, so money never leaves the model as a float.
 */
type DecimalAttribute = 'hardwarePrice' | 'labourPrice' | 'extrasPrice' | 'discountAmount' | 'taxRatePercent' | 'subtotal' | 'taxAmount' | 'total';

function decimalGetter(name: DecimalAttribute, places: number) {
  return function (this: Quote): string {
    const v = this.getDataValue(name) as unknown;
    return v === null || v === undefined ? (v as unknown as string) : new Decimal(String(v)).toFixed(places);
  };
}

const money = (name: DecimalAttribute) => ({ type: DataTypes.DECIMAL(12, 2), allowNull: false, defaultValue: '0.00', get: decimalGetter(name, 2) });

export function initQuote(sequelize: Sequelize): void {
  Quote.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      studyId: { type: DataTypes.INTEGER, allowNull: true },
      status: { type: DataTypes.ENUM(...QUOTE_STATUSES), allowNull: false, defaultValue: 'draft' },
      title: { type: DataTypes.STRING(200), allowNull: false },
      customerName: { type: DataTypes.STRING(160), allowNull: false },
      customerEmail: { type: DataTypes.STRING(254), allowNull: true },
      siteName: { type: DataTypes.STRING(160), allowNull: false },
      serviceName: { type: DataTypes.STRING(120), allowNull: false },
      chosenOptionIndex: { type: DataTypes.INTEGER, allowNull: false },
      recommendedOptionIndex: { type: DataTypes.INTEGER, allowNull: true },
      chosenOption: { type: DataTypes.JSON, allowNull: false },
      options: { type: DataTypes.JSON, allowNull: false },
      studySnapshot: { type: DataTypes.JSON, allowNull: false },
      currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
      hardwarePrice: money('hardwarePrice'),
      labourPrice: money('labourPrice'),
      extrasLabel: { type: DataTypes.STRING(120), allowNull: true },
      extrasPrice: money('extrasPrice'),
      discountAmount: money('discountAmount'),
      taxRatePercent: { type: DataTypes.DECIMAL(6, 3), allowNull: false, defaultValue: '0.000', get: decimalGetter('taxRatePercent', 3) },
      subtotal: money('subtotal'),
      taxAmount: money('taxAmount'),
      total: money('total'),
      validUntil: { type: DataTypes.DATEONLY, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      firstViewedAt: { type: DataTypes.DATE, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      decidedByName: { type: DataTypes.STRING(160), allowNull: true },
      decisionComment: { type: DataTypes.STRING(1000), allowNull: true },
      decisionIp: { type: DataTypes.STRING(64), allowNull: true },
      decisionUserAgent: { type: DataTypes.STRING(255), allowNull: true },
      decisionLinkId: { type: DataTypes.INTEGER, allowNull: true },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      sentByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'quotes', underscored: true },
  );
}
