import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import type { AttemptKind } from '@/db/models/sign-in-attempt';

/** How many counted attempts lie inside the window for this key. */
export async function countAttempts(kind: AttemptKind, key: { email?: string; ip?: string }, since: Date, failuresOnly: boolean): Promise<number> {
  const { SignInAttempt } = models();
  return SignInAttempt.count({
    where: { kind, ...key, createdAt: { [Op.gte]: since }, ...(failuresOnly ? { succeeded: false } : {}) },
  });
}

/**
 * When the count for this key drops below `max` again: the time of the max-th newest counted
 * attempt in the window (once it ages out, one slot is free). Null when under the limit.
 */
export async function nthNewestAttemptAt(kind: AttemptKind, key: { email?: string; ip?: string }, since: Date, failuresOnly: boolean, n: number): Promise<Date | null> {
  const { sequelize } = models();
  const column = key.email !== undefined ? 'email' : 'ip';
  const value = key.email ?? key.ip ?? null;
  const rows = await sequelize.query<{ created_at: string }>(
    `SELECT created_at FROM sign_in_attempts
      WHERE kind = :kind AND ${column} = :value AND created_at >= :since ${failuresOnly ? 'AND succeeded = 0' : ''}
      ORDER BY created_at DESC, id DESC
      LIMIT 1 OFFSET ${Math.max(0, Math.floor(n) - 1)}`,
    { replacements: { kind, value, since }, type: QueryTypes.SELECT },
  );
  return rows[0] ? new Date(rows[0].created_at) : null;
}

export async function insertAttempt(kind: AttemptKind, email: string | null, ip: string | null, succeeded: boolean): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.create({ kind, email, ip, succeeded });
}

/** A correct password wipes the address's failures (not the IP's: others may share it). */
export async function clearEmailFailures(kind: AttemptKind, email: string): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.destroy({ where: { kind, email, succeeded: false } });
}

export async function deleteAttemptsOlderThan(cutoff: Date): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.destroy({ where: { createdAt: { [Op.lt]: cutoff } } });
}
