import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** A customer account of FadeLedger: an installer or reseller company. Every private row carries its id. */
export class Company extends Model<InferAttributes<Company>, InferCreationAttributes<Company>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare planId: number;
  declare trialEndsAt: Date | null;
  declare contactEmail: CreationOptional<string | null>;
  declare contactPhone: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCompany(sequelize: Sequelize): void {
  Company.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      planId: { type: DataTypes.INTEGER, allowNull: false },
      trialEndsAt: { type: DataTypes.DATE, allowNull: true },
      contactEmail: { type: DataTypes.STRING(254), allowNull: true },
      contactPhone: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'companies', underscored: true },
  );
}
