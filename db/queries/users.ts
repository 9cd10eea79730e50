import 'server-only';
import type { Transaction } from 'sequelize';
import { randomBytes } from 'node:crypto';
import { models } from '@/db/models';

export type UserRow = InstanceType<ReturnType<typeof models>['User']>;

/** Addresses are stored trimmed and lower-cased; look them up the same way. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export function newUserId(): string {
  return 'usr_' + randomBytes(12).toString('base64url');
}

export async function findUserByEmail(email: string, t?: Transaction): Promise<UserRow | null> {
  const { User } = models();
  return User.findOne({ where: { email: normaliseEmail(email) }, transaction: t });
}

export async function findUserById(id: string, t?: Transaction): Promise<UserRow | null> {
  const { User } = models();
  return User.findByPk(id, { transaction: t });
}

/** Locks the person's row until the transaction ends: serialises changes to their account. */
export async function lockUser(id: string, t: Transaction): Promise<UserRow | null> {
  const { User } = models();
  return User.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
}

export async function createUser(data: { email: string; name: string; passwordHash: string }, t: Transaction): Promise<UserRow> {
  const { User } = models();
  return User.create({ id: newUserId(), email: normaliseEmail(data.email), name: data.name, passwordHash: data.passwordHash }, { transaction: t });
}

export async function setUserPassword(userId: string, passwordHash: string, t?: Transaction): Promise<void> {
  const { User } = models();
  await User.update({ passwordHash }, { where: { id: userId }, transaction: t });
}
