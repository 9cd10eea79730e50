import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { models } from '@/db/models';

/**
 * Stores a new link and retires every earlier unused one of that person, inside the caller's
 * transaction (which also writes the audit row): only the newest link works.
 */
export async function replaceResetTokens(data: { userId: string; tokenHash: string; expiresAt: Date; requestedIp: string | null }, t: Transaction): Promise<void> {
  const { PasswordResetToken } = models();
  await PasswordResetToken.update({ usedAt: new Date() }, { where: { userId: data.userId, usedAt: null }, transaction: t });
  await PasswordResetToken.create(data, { transaction: t });
}

export async function findResetTokenByHash(tokenHash: string, t?: Transaction, lock = false) {
  const { PasswordResetToken } = models();
  return PasswordResetToken.findOne({ where: { tokenHash }, transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
}

export async function markResetTokenUsed(id: number, t: Transaction): Promise<void> {
  const { PasswordResetToken } = models();
  await PasswordResetToken.update({ usedAt: new Date() }, { where: { id }, transaction: t });
}

/** Old links are useless after a day; sweep them when a new one is made. */
export async function deleteStaleResetTokens(): Promise<void> {
  const { PasswordResetToken } = models();
  await PasswordResetToken.destroy({ where: { expiresAt: { [Op.lt]: new Date(Date.now() - 24 * 3600_000) } } });
}
