import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/**
 * A company's API key. The key itself is shown once and never stored: only its sha256 digest
 * (tokenHash) and a short visible prefix to recognise it by. Revoked keys are kept for the record.
 */
export class ApiKey extends Model<InferAttributes<ApiKey>, InferCreationAttributes<ApiKey>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare prefix: string;
  declare tokenHash: string;
  /** Comma-separated scopes; read them through parseScopes (server/auth/api-scopes.ts). */
  declare scopes: string;
  declare rateLimitPerMinute: CreationOptional<number>;
  declare createdByUserId: string | null;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare lastUsedIp: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedByUserId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initApiKey(sequelize: Sequelize): void {
  ApiKey.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      prefix: { type: DataTypes.STRING(16), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      scopes: { type: DataTypes.STRING(100), allowNull: false },
      rateLimitPerMinute: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 120 },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      lastUsedAt: { type: DataTypes.DATE, allowNull: true },
      lastUsedIp: { type: DataTypes.STRING(64), allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      revokedByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'api_keys', underscored: true },
  );
}
