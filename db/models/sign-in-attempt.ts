import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const ATTEMPT_KINDS = ['sign_in', 'reset_request', 'sign_up'] as const;
export type AttemptKind = (typeof ATTEMPT_KINDS)[number];

/** One attempt at a throttled door (sign-in, reset request, sign-up), by address and IP. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare kind: AttemptKind;
  declare email: string | null;
  declare ip: string | null;
  declare succeeded: boolean;
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
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sign_in_attempts', underscored: true, updatedAt: false },
  );
}
