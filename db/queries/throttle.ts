import 'server-only';
import { createHash } from 'node:crypto';
import { Op, QueryTypes, Transaction, type WhereOptions } from 'sequelize';
import { models } from '@/db/models';
import type { AttemptKind, SignInAttempt } from '@/db/models/sign-in-attempt';

/**
 * One throttle bucket: the attempts of a kind that match every condition given. A null value
 * matches NULL (the shared bucket of requests whose IP is unknown); `trusted: false` keeps
 * attempts from browsers trusted for their address out of the buckets strangers share.
 */
export type AttemptKey = { email?: string; ip?: string | null; client?: string; trusted?: false };

const COLUMNS = ['email', 'ip', 'client', 'trusted'] as const;

function whereOf(kind: AttemptKind, key: AttemptKey, since: Date, now: Date, failuresOnly: boolean): WhereOptions<SignInAttempt> {
  // The upper bound keeps the count to attempts that had happened by `now` (tests look at a
  // moment of their own without disturbing anyone else's window).
  return { kind, ...key, createdAt: { [Op.gte]: since, [Op.lte]: now }, ...(failuresOnly ? { succeeded: false } : {}) } as WhereOptions<SignInAttempt>;
}

/** How many counted attempts lie inside the window for this key. */
export async function countAttempts(kind: AttemptKind, key: AttemptKey, since: Date, now: Date, failuresOnly: boolean, t?: Transaction): Promise<number> {
  const { SignInAttempt } = models();
  return SignInAttempt.count({ where: whereOf(kind, key, since, now, failuresOnly), transaction: t });
}

/**
 * When the count for this key drops below `max` again: the time of the max-th newest counted
 * attempt in the window (once it ages out, one slot is free). Null when under the limit.
 */
export async function nthNewestAttemptAt(kind: AttemptKind, key: AttemptKey, since: Date, now: Date, failuresOnly: boolean, n: number, t?: Transaction): Promise<Date | null> {
  const { SignInAttempt } = models();
  const rows = await SignInAttempt.findAll({
    attributes: ['createdAt'],
    where: whereOf(kind, key, since, now, failuresOnly),
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    offset: Math.max(0, Math.floor(n) - 1),
    limit: 1,
    transaction: t,
  });
  return rows[0]?.createdAt ?? null;
}

export async function insertAttempt(
  kind: AttemptKind,
  who: { email: string | null; ip: string | null; client?: string | null; trusted?: boolean },
  succeeded: boolean,
  createdAt: Date,
  t?: Transaction,
): Promise<number> {
  const { SignInAttempt } = models();
  const row = await SignInAttempt.create({ kind, email: who.email, ip: who.ip, client: who.client ?? null, trusted: who.trusted ?? false, succeeded, createdAt }, { transaction: t });
  return row.id;
}

export async function markAttemptSucceeded(id: number): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.update({ succeeded: true }, { where: { id } });
}

/** Wipes an address's failures at a door: all of them, or only those made from the given clients. */
export async function clearEmailFailures(kind: AttemptKind, email: string, clients?: string[]): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.destroy({ where: { kind, email, succeeded: false, ...(clients ? { client: clients } : {}) } });
}

export async function deleteAttemptsOlderThan(cutoff: Date): Promise<void> {
  const { SignInAttempt } = models();
  await SignInAttempt.destroy({ where: { createdAt: { [Op.lt]: cutoff } } });
}

const LOCK_WAIT_SECONDS = 10;

/** MariaDB lock names are at most 64 characters; a digest keeps addresses out of them too. */
function lockName(kind: AttemptKind, key: AttemptKey): string {
  const parts = COLUMNS.map((c) => (c in key ? `${c}=${key[c] ?? '\u0000null'}` : ''));
  return 'fl_throttle_' + createHash('sha1').update(`${kind}\u0000${parts.join('\u0000')}`).digest('hex');
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
