import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** Who did what to whom, when and from where: team and security events, read by admins. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare companyId: number | null;
  declare actorUserId: string | null;
  declare actorLabel: string | null;
  declare action: string;
  declare subjectUserId: string | null;
  declare targetLabel: string | null;
  declare detail: string | null;
  declare ip: string | null;
  declare userAgent: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEvent(sequelize: Sequelize): void {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: true },
      actorUserId: { type: DataTypes.STRING(40), allowNull: true },
      actorLabel: { type: DataTypes.STRING(300), allowNull: true },
      action: { type: DataTypes.STRING(60), allowNull: false },
      subjectUserId: { type: DataTypes.STRING(40), allowNull: true },
      targetLabel: { type: DataTypes.STRING(300), allowNull: true },
      detail: { type: DataTypes.TEXT, allowNull: true },
      ip: { type: DataTypes.STRING(64), allowNull: true },
      userAgent: { type: DataTypes.STRING(255), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'audit_events', underscored: true, updatedAt: false },
  );
}
