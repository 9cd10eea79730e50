import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { models } from '@/db/models';

export type SessionListing = { digest: string; createdAt: Date; expiresAt: Date; ip: string | null; userAgent: string | null; activeCompanyId: number | null };

/** A person's unexpired sessions, newest first. Sessions are keyed by the digest of their token. */
export async function listUserSessions(userId: string): Promise<SessionListing[]> {
  const { Session } = models();
  const rows = await Session.findAll({ where: { userId }, order: [['createdAt', 'DESC']] });
  const now = Date.now();
  return rows
    .filter((r) => new Date(r.expiresAt).getTime() > now)
    .map((r) => ({ digest: r.id, createdAt: r.createdAt, expiresAt: r.expiresAt, ip: r.ip, userAgent: r.userAgent, activeCompanyId: r.activeCompanyId }));
}

/** Deletes one of the person's own sessions; 0 when the digest is not theirs. */
export async function deleteUserSession(userId: string, digest: string): Promise<number> {
  const { Session } = models();
  return Session.destroy({ where: { id: digest, userId } });
}

export async function deleteAllUserSessions(userId: string, t?: Transaction): Promise<number> {
  const { Session } = models();
  return Session.destroy({ where: { userId }, transaction: t });
}

/** A removed member's sessions that were working in this company stop at once. */
export async function deleteUserSessionsInCompany(userId: string, companyId: number, t?: Transaction): Promise<number> {
  const { Session } = models();
  return Session.destroy({ where: { userId, activeCompanyId: companyId }, transaction: t });
}

export async function setSessionActiveCompany(digest: string, companyId: number | null): Promise<void> {
  const { Session } = models();
  await Session.update({ activeCompanyId: companyId }, { where: { id: digest } });
}

/** Every session of the person except the one given (after a password change). */
export async function deleteUserSessionsExcept(userId: string, keepDigest: string, t?: Transaction): Promise<number> {
  const { Session } = models();
  return Session.destroy({ where: { userId, id: { [Op.ne]: keepDigest } }, transaction: t });
}
