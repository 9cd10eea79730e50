import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/**
 * A comparison link: the customer's way into one quote, without an account. Look-ups go by the
 * token's sha256; the token itself is kept only sealed (AES-256-GCM, server/quotes/link-token-seal.ts)
 * so the team can copy the link again. Active while not revoked and not past expires_at.
 */
export class ShareLink extends Model<InferAttributes<ShareLink>, InferCreationAttributes<ShareLink>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare quoteId: number;
  declare tokenHash: string;
  declare tokenSealed: string | null;
  declare expiresAt: Date;
  declare revokedAt: Date | null;
  declare revokedByUserId: string | null;
  declare viewCount: CreationOptional<number>;
  declare lastViewedAt: Date | null;
  declare createdByUserId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initShareLink(sequelize: Sequelize): void {
  ShareLink.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      quoteId: { type: DataTypes.INTEGER, allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      tokenSealed: { type: DataTypes.STRING(200), allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      revokedByUserId: { type: DataTypes.STRING(40), allowNull: true },
      viewCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastViewedAt: { type: DataTypes.DATE, allowNull: true },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'share_links', underscored: true },
  );
}
