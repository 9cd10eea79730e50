import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const COMPANY_ROLES = ['admin', 'installer', 'sales'] as const;
export type CompanyRole = (typeof COMPANY_ROLES)[number];

/** A person's role in one company. */
export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare userId: string;
  declare role: CompanyRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMembership(sequelize: Sequelize): void {
  Membership.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.STRING(40), allowNull: false },
      role: { type: DataTypes.ENUM(...COMPANY_ROLES), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'memberships', underscored: true },
  );
}
