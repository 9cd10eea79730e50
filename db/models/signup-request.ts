import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/**
 * A sign-up waiting for its address to be confirmed: the company, membership and person are
 * created only when the single-use link is opened. Token kept as its sha256 digest only.
 */
export class SignupRequest extends Model<InferAttributes<SignupRequest>, InferCreationAttributes<SignupRequest>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare companyName: string;
  declare passwordHash: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare requestedIp: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initSignupRequest(sequelize: Sequelize): void {
  SignupRequest.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      email: { type: DataTypes.STRING(254), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      companyName: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING(255), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      requestedIp: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'signup_requests', underscored: true, updatedAt: false },
  );
}
