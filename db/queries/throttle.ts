import 'server-only';
import { createHash } from 'node:crypto';
import { Op, QueryTypes, Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { AttemptKind } from '@/db/models/sign-in-attempt';

/** One throttle bucket: attempts of a kind by one address, one IP, or (ip: null) every unknown IP. */
export type AttemptKey = { column: 'email'; value: string } | { column: 'ip'; value: string | null };

/** How many counted attempts lie inside the window for this key. */
export async function countAttempts(kind: AttemptKind, key: AttemptKey, since: Date, failuresOnly: boolean, t?: Transaction): Promise<number> {
  const { SignInAttempt } = models();
  return SignInAttempt.count({
    // A null value becomes IS NULL: the shared bucket of requests whose IP is unknown.
    where: { kind, [key.column]: key.value, createdAt: { [Op.gte]: since }, ...(failuresOnly ? { succeeded: false } : {}) },
    transaction: t,
  });
}

/**
 * When the count for this key drops below `max` again: the time of the max-th newest counted
 * attempt in the window (once it ages out, one slot is free). Null when under the limit.
 */
export async function nthNewestAttemptAt(kind: AttemptKind, key: AttemptKey, since: Date, failuresOnly: boolean, n: number, t?: Transaction): Promise<Date | null> {
  const { sequelize } = models();
  const column = key.column === 'email' ? 'email' : 'ip';
  const rows = await sequelize.query<{ created_at: string }>(
    `SELECT created_at FROM sign_in_attempts
      WHERE kind = :kind AND ${column} <=> :value AND created_at >= :since ${failuresOnly ? 'AND succeeded = 0' : ''}
      ORDER BY created_at DESC, id DESC
      LIMIT 1 OFFSET ${Math.max(0, Math.floor(n) - 1)}`,
    { replacements: { kind, value: key.value, since }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows[0] ? new Date(rows[0].created_at) : null;
}

export async function insertAttempt(kind: AttemptKind, email: string | null, ip: string | null, succeeded: boolean, t?: Transaction): Promise<number> {
  const { SignInAttempt } = models();
  const row = await SignInAttempt.create({ kind, email, ip, succeeded }, { transaction: t });
  return row.id;
}

export async function markAttemptSucceeded(id: number): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.update({ succeeded: true }, { where: { id } });
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

const LOCK_WAIT_SECONDS = 10;

/** MariaDB lock names are at most 64 characters; a digest keeps addresses out of them too. */
function lockName(kind: AttemptKind, key: AttemptKey): string {
  return 'fl_throttle_' + createHash('sha1').update(`${kind}\u0000${key.column}\u0000${key.value ?? '\u0000unknown'}`).digest('hex');
}

/**
 * Runs `fn` (count, then insert) while holding one named lock per bucket, so two requests for
 * the same bucket cannot both count before either has inserted. Locks are taken in sorted
 * order (no two requests can wait on each other in a cycle) on the transaction's connection.
 *
 * The lock is released just before the transaction commits, so the next holder may count a
 * row that is inserted but not yet committed: READ UNCOMMITTED lets it see that row. At worst
 * it counts a row that is then rolled back, which only errs towards refusing.
 *
 * Returns null when a lock could not be had within LOCK_WAIT_SECONDS (the caller refuses).
 */
export async function withBucketLocks<T>(kind: AttemptKind, keys: AttemptKey[], fn: (t: Transaction) => Promise<T>): Promise<{ value: T } | null> {
  const { sequelize } = models();
  const names = [...new Set(keys.map((k) => lockName(kind, k)))].sort();
  return sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_UNCOMMITTED }, async (t) => {
    const held: string[] = [];
    try {
      for (const name of names) {
        const [row] = await sequelize.query<{ got: number | null }>('SELECT GET_LOCK(:name, :wait) AS got', { replacements: { name, wait: LOCK_WAIT_SECONDS }, type: QueryTypes.SELECT, transaction: t });
        if (Number(row?.got) !== 1) return null;
        held.push(name);
      }
      return { value: await fn(t) };
    } finally {
      for (const name of held.reverse()) await sequelize.query('SELECT RELEASE_LOCK(:name)', { replacements: { name }, type: QueryTypes.SELECT, transaction: t });
    }
  });
}
