import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** A lucia v3 session, stored in MariaDB so any app instance can read it. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string;
  declare userId: string;
  declare activeCompanyId: number | null;
  declare expiresAt: Date;
  declare ip: string | null;
  declare userAgent: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initSession(sequelize: Sequelize): void {
  Session.init(
    {
      id: { type: DataTypes.STRING(64), primaryKey: true },
      userId: { type: DataTypes.STRING(40), allowNull: false },
      activeCompanyId: { type: DataTypes.INTEGER, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      ip: { type: DataTypes.STRING(64), allowNull: true },
      userAgent: { type: DataTypes.STRING(255), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sessions', underscored: true, updatedAt: false },
  );
}
