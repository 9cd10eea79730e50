import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { CompanyRole } from './membership';
import { COMPANY_ROLES } from './membership';

/**
 * An invitation to join a company with a role. Pending (not accepted, not revoked, not expired)
 * invitations hold a seat. The link's token is stored only as its sha256 digest.
 */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare email: string;
  declare role: CompanyRole;
  declare tokenHash: string;
  declare invitedByUserId: string | null;
  declare expiresAt: Date;
  declare lastSentAt: Date;
  declare sendCount: CreationOptional<number>;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedUserId: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initInvitation(sequelize: Sequelize): void {
  Invitation.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...COMPANY_ROLES), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      invitedByUserId: { type: DataTypes.STRING(40), allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      lastSentAt: { type: DataTypes.DATE, allowNull: false },
      sendCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedUserId: { type: DataTypes.STRING(40), allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'invitations', underscored: true },
  );
}
