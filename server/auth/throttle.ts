import 'server-only';
import { createHash } from 'node:crypto';
import { RateLimitedError } from '@/server/errors';
import type { AttemptKind } from '@/db/models/sign-in-attempt';
import {
  clearEmailFailures,
  countAttempts,
  deleteAttemptsOlderThan,
  insertAttempt,
  markAttemptSucceeded,
  nthNewestAttemptAt,
  withBucketLocks,
  type AttemptKey,
} from '@/db/queries/throttle';
import { deleteStaleTrustedClients, deleteStaleUnlockTokens } from '@/db/queries/sign-in-trust';

type Rule = { max: number; windowMinutes: number };
export type Bucket = 'client' | 'email' | 'ip' | 'unknownIp' | 'global';
type DoorRules = {
  /** One address from one client (the IP behind a trusted proxy, else the browser's client cookie). */
  perClient?: Rule;
  /** One address, from every client not trusted for it. */
  perEmail?: Rule;
  /** One IP (known only behind a trusted proxy), across addresses. */
  perIp?: Rule;
  /**
   * Only when the client IP is unknown (TRUST_PROXY off, or no X-Forwarded-For): one bucket
   * shared by every such request. Without it, a door whose only guard is per-IP is unguarded.
   */
  unknownIp?: Rule;
  /** Every untrusted attempt at this door, whoever and wherever: the backstop against a spray from many clients. */
  global?: Rule;
  failuresOnly: boolean;
  message: (minutes: number, bucket: Bucket) => string;
};

/** Said whether or not the address has an account (server/auth/sign-in-unlock.ts mails only real ones). */
export const UNLOCK_HINT = ' If an account uses this address, we have e-mailed it a link that lets your browser sign in straight away.';

const inMinutes = (m: number) => `${m} ${m === 1 ? 'minute' : 'minutes'}`;

/**
 * Throttles, kept in MariaDB so every app instance sees the same counts. Limits are common
 * practice, no source.
 *
 * Sign-in is limited so that a stranger can slow down guessing but cannot lock the owner out:
 * a handful of wrong passwords lock the address *on that client* only; the wider per-address,
 * per-IP and global budgets count only attempts from browsers not trusted for the address, and a
 * browser the owner has signed in from (or unlocked with the mailed link) skips them. A stranger
 * dropping cookies gets a fresh client every time, which is why the per-address and global
 * budgets exist; the owner on a new browser they block gets a mailed link (server/auth/sign-in-unlock.ts).
 *
 * Reset mails are few per address so nobody can flood an inbox. Sign-up is limited per address
 * (so nobody probes which addresses have accounts) and, when the IP is unknown, by one shared
 * bucket — a backstop one party can fill for the rest of the hour, so production should set
 * TRUST_PROXY behind its load balancer, which brings the per-IP rule back instead.
 */
export const THROTTLE_RULES: Record<AttemptKind, DoorRules> = {
  sign_in: {
    perClient: { max: 5, windowMinutes: 15 },
    perEmail: { max: 10, windowMinutes: 60 },
    perIp: { max: 30, windowMinutes: 15 },
    // Far above what people mistype in a quarter hour, far below a spray across many addresses.
    global: { max: 1000, windowMinutes: 15 },
    failuresOnly: true,
    message: (m, bucket) =>
      (bucket === 'client'
        ? `Too many wrong passwords for this address from this browser. Try again in ${inMinutes(m)}.`
        : bucket === 'global'
          ? `Too many sign-in attempts right now. Try again in ${inMinutes(m)}.`
          : `Too many sign-in attempts for this address. Try again in ${inMinutes(m)}.`) + UNLOCK_HINT,
  },
  reset_request: {
    perEmail: { max: 3, windowMinutes: 60 },
    perIp: { max: 20, windowMinutes: 60 },
    failuresOnly: false,
    message: (m) => `Too many reset requests. Try again in ${inMinutes(m)}.`,
  },
  sign_up: {
    perEmail: { max: 3, windowMinutes: 60 },
    perIp: { max: 10, windowMinutes: 60 },
    unknownIp: { max: 50, windowMinutes: 60 },
    failuresOnly: false,
    message: (m, bucket) =>
      bucket === 'email'
        ? `Too many sign-up attempts for this address. Try again in ${inMinutes(m)}.`
        : bucket === 'ip'
          ? `Too many new accounts from this network. Try again in ${inMinutes(m)}.`
          : `Too many new accounts right now. Try again in ${inMinutes(m)}.`,
  },
};

/**
 * Who is knocking. `client` is the digest naming the client for the per-client bucket (see
 * clientDigest); `trusted` says the browser is trusted for this address.
 */
export type Who = { email: string | null; ip: string | null; client?: string | null; trusted?: boolean };

/** The stored name of a client: never the raw cookie (it is what makes a browser trusted). */
export function clientDigest(kind: 'ip' | 'cookie', value: string): string {
  return createHash('sha256').update(`${kind}:${value}`, 'utf8').digest('hex');
}

type Planned = { bucket: Bucket; rule: Rule; key: AttemptKey; locked: boolean };

function bucketsFor(rules: DoorRules, who: Who): Planned[] {
  const out: Planned[] = [];
  if (who.email && who.client && rules.perClient) out.push({ bucket: 'client', rule: rules.perClient, key: { email: who.email, client: who.client }, locked: true });
  // A browser trusted for the address answers only for itself: what strangers do to the shared
  // budgets cannot lock it out.
  if (who.trusted) return out;
  if (who.email && rules.perEmail) out.push({ bucket: 'email', rule: rules.perEmail, key: { email: who.email, trusted: false }, locked: true });
  if (who.ip && rules.perIp) out.push({ bucket: 'ip', rule: rules.perIp, key: { ip: who.ip, trusted: false }, locked: true });
  if (!who.ip && rules.unknownIp) out.push({ bucket: 'unknownIp', rule: rules.unknownIp, key: { ip: null, trusted: false }, locked: true });
  // Not locked: one lock every untrusted sign-in in the cluster waits on would turn a flood into
  // a queue for everyone. A burst may overrun the global budget by the requests in flight.
  if (rules.global) out.push({ bucket: 'global', rule: rules.global, key: { trusted: false }, locked: false });
  return out;
}

/** One attempt that got past the throttle; settle it once the outcome is known. */
export type Attempt = { id: number; kind: AttemptKind };

/**
 * Takes a slot at this door, or throws RateLimitedError (with minutes to wait) when one of the
 * buckets that apply is full. Counting and recording happen as one step under a per-bucket lock,
 * and the attempt is recorded as a failure until settled, so a burst of parallel requests cannot
 * all pass the count before any has been recorded. A refused request records nothing: only
 * attempts that were really made count. `now` is the moment to judge (tests pass their own).
 */
export async function claimAttempt(kind: AttemptKind, who: Who, now = new Date()): Promise<Attempt> {
  const rules = THROTTLE_RULES[kind];
  const buckets = bucketsFor(rules, who);
  const outcome = await withBucketLocks(
    kind,
    buckets.filter((b) => b.locked).map((b) => b.key),
    async (t): Promise<{ refused: { seconds: number; bucket: Bucket } } | { id: number }> => {
      let wait: { seconds: number; bucket: Bucket } | null = null;
      for (const { bucket, rule, key } of buckets) {
        const since = new Date(now.getTime() - rule.windowMinutes * 60_000);
        const n = await countAttempts(kind, key, since, now, rules.failuresOnly, t);
        if (n < rule.max) continue;
        const freedAt = await nthNewestAttemptAt(kind, key, since, now, rules.failuresOnly, rule.max, t);
        const seconds = Math.max(1, freedAt ? Math.ceil((freedAt.getTime() + rule.windowMinutes * 60_000 - now.getTime()) / 1000) : rule.windowMinutes * 60);
        if (!wait || seconds > wait.seconds) wait = { seconds, bucket };
      }
      if (wait !== null) return { refused: wait };
      return { id: await insertAttempt(kind, { email: who.email, ip: who.ip, client: who.client, trusted: who.trusted }, false, now, t) };
    },
  );
  // Could not even get the lock: the bucket is under siege, so refuse rather than guess.
  if (!outcome) throw new ThrottledError(60, rules.message(1, buckets[0]?.bucket ?? 'email'), buckets[0]?.bucket ?? 'email');
  const result = outcome.value;
  if ('refused' in result) {
    const minutes = Math.max(1, Math.ceil(result.refused.seconds / 60));
    throw new ThrottledError(result.refused.seconds, rules.message(minutes, result.refused.bucket), result.refused.bucket);
  }
  return { id: result.id, kind };
}

/** A refusal that also says which bucket was full (the sign-in door mails an unlock link). */
export class ThrottledError extends RateLimitedError {
  constructor(
    retryAfterSeconds: number,
    message: string,
    public readonly bucket: Bucket,
  ) {
    super(retryAfterSeconds, message);
  }
}

/** The attempt worked (right password, account made, reset handled): it is no failure. */
export async function settleAttempt(attempt: Attempt): Promise<void> {
  await markAttemptSucceeded(attempt.id);
}

/**
 * Forgets an address's failures at a door: those from the given clients (a right password
 * clears only the client that gave it), or all of them (the owner proved the mailbox is theirs).
 */
export async function forgiveAddress(kind: AttemptKind, email: string, clients?: string[]): Promise<void> {
  await clearEmailFailures(kind, email, clients);
}

/** Attempts older than the widest window count for nothing; sweep them now and then. */
export async function sweepOldAttempts(now = new Date()): Promise<void> {
  const widest = Math.max(...Object.values(THROTTLE_RULES).flatMap((r) => [r.perClient, r.perEmail, r.perIp, r.unknownIp, r.global].map((rule) => rule?.windowMinutes ?? 0)));
  await deleteAttemptsOlderThan(new Date(now.getTime() - 2 * widest * 60_000));
  await deleteStaleTrustedClients(now);
  await deleteStaleUnlockTokens();
}
