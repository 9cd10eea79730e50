import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** A single-use, expiring password-reset link; only the sha256 digest of its token is kept. */
export class PasswordResetToken extends Model<InferAttributes<PasswordResetToken>, InferCreationAttributes<PasswordResetToken>> {
  declare id: CreationOptional<number>;
  declare userId: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare requestedIp: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initPasswordResetToken(sequelize: Sequelize): void {
  PasswordResetToken.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      userId: { type: DataTypes.STRING(40), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      requestedIp: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'password_reset_tokens', underscored: true, updatedAt: false },
  );
}
