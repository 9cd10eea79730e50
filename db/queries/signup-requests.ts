import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { models } from '@/db/models';

export type SignupRequestRow = InstanceType<ReturnType<typeof models>['SignupRequest']>;

/**
 * Stores a pending sign-up and retires every earlier unused one for the address: only the
 * newest link works (a second form with a different company name replaces the first).
 */
export async function replaceSignupRequests(
  data: { email: string; name: string; companyName: string; passwordHash: string; tokenHash: string; expiresAt: Date; requestedIp: string | null },
  t: Transaction,
): Promise<void> {
  const { SignupRequest } = models();
  await SignupRequest.update({ usedAt: new Date() }, { where: { email: data.email, usedAt: null }, transaction: t });
  await SignupRequest.create(data, { transaction: t });
}

/** With `lock`, the row is held FOR UPDATE so two openings of one link queue behind each other. */
export async function findSignupRequestByHash(tokenHash: string, t?: Transaction, lock = false): Promise<SignupRequestRow | null> {
  const { SignupRequest } = models();
  return SignupRequest.findOne({ where: { tokenHash }, transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
}

export async function markSignupRequestUsed(id: number, t: Transaction): Promise<void> {
  const { SignupRequest } = models();
  await SignupRequest.update({ usedAt: new Date() }, { where: { id }, transaction: t });
}

/** Pending sign-ups hold a password hash: drop them a day after they expired. */
export async function deleteStaleSignupRequests(): Promise<void> {
  const { SignupRequest } = models();
  await SignupRequest.destroy({ where: { expiresAt: { [Op.lt]: new Date(Date.now() - 24 * 3600_000) } } });
}
