import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const ATTEMPT_KINDS = ['sign_in', 'reset_request', 'sign_up'] as const;
export type AttemptKind = (typeof ATTEMPT_KINDS)[number];

/**
 * One attempt at a throttled door (sign-in, reset request, sign-up), by address and IP; sign-ins
 * also by client (sha256 of the IP behind a trusted proxy or of the browser's client cookie) and
 * whether that browser was trusted for the address.
 */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare kind: AttemptKind;
  declare email: string | null;
  declare ip: string | null;
  declare succeeded: boolean;
  declare client: CreationOptional<string | null>;
  declare trusted: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
}

export function initSignInAttempt(sequelize: Sequelize): void {
  SignInAttempt.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      kind: { type: DataTypes.ENUM(...ATTEMPT_KINDS), allowNull: false, defaultValue: 'sign_in' },
      email: { type: DataTypes.STRING(254), allowNull: true },
      ip: { type: DataTypes.STRING(64), allowNull: true },
      succeeded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      client: { type: DataTypes.CHAR(64), allowNull: true },
      trusted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sign_in_attempts', underscored: true, updatedAt: false },
  );
}
