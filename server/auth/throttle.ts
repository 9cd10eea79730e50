import 'server-only';
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

type Rule = { max: number; windowMinutes: number };
export type Bucket = 'email' | 'ip' | 'unknownIp';
type DoorRules = {
  perEmail?: Rule;
  perIp?: Rule;
  /**
   * Only when the client IP is unknown (TRUST_PROXY off, or no X-Forwarded-For): one bucket
   * shared by every such request. Without it, a door whose only guard is per-IP is unguarded.
   */
  unknownIp?: Rule;
  failuresOnly: boolean;
  message: (minutes: number, bucket: Bucket) => string;
};

const inMinutes = (m: number) => `${m} ${m === 1 ? 'minute' : 'minutes'}`;

/**
 * Throttles, kept in MariaDB so every app instance sees the same counts. Limits are common
 * practice, no source: a handful of wrong passwords per address, a wider allowance per IP
 * (offices share one), and few reset mails per address so nobody can flood an inbox.
 *
 * Sign-up is also limited per address (so nobody probes which addresses have accounts, or
 * retries one address endlessly) and, when the IP is unknown, by one shared bucket. That
 * bucket is a backstop for a deployment without a trusted proxy: one party can fill it and
 * hold up every sign-up for the rest of the hour, so production should set TRUST_PROXY behind
 * its load balancer, which brings the per-IP rule back and takes the shared bucket out.
 */
export const THROTTLE_RULES: Record<AttemptKind, DoorRules> = {
  sign_in: {
    perEmail: { max: 5, windowMinutes: 15 },
    perIp: { max: 30, windowMinutes: 15 },
    failuresOnly: true,
    message: (m) => `Too many sign-in attempts. Try again in ${inMinutes(m)}.`,
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

type Who = { email: string | null; ip: string | null };

function bucketsFor(rules: DoorRules, who: Who): { bucket: Bucket; rule: Rule; key: AttemptKey }[] {
  const out: { bucket: Bucket; rule: Rule; key: AttemptKey }[] = [];
  if (who.email && rules.perEmail) out.push({ bucket: 'email', rule: rules.perEmail, key: { column: 'email', value: who.email } });
  if (who.ip && rules.perIp) out.push({ bucket: 'ip', rule: rules.perIp, key: { column: 'ip', value: who.ip } });
  if (!who.ip && rules.unknownIp) out.push({ bucket: 'unknownIp', rule: rules.unknownIp, key: { column: 'ip', value: null } });
  return out;
}

/** One attempt that got past the throttle; settle it once the outcome is known. */
export type Attempt = { id: number; kind: AttemptKind };

/**
 * Takes a slot at this door, or throws RateLimitedError (with minutes to wait) when the
 * address, the IP or the unknown-IP bucket is full. Counting and recording happen as one step
 * under a per-bucket lock, and the attempt is recorded as a failure until settled, so a burst
 * of parallel requests cannot all pass the count before any has been recorded. A refused
 * request records nothing: only attempts that were really made count.
 */
export async function claimAttempt(kind: AttemptKind, who: Who, now = new Date()): Promise<Attempt> {
  const rules = THROTTLE_RULES[kind];
  const buckets = bucketsFor(rules, who);
  const outcome = await withBucketLocks(
    kind,
    buckets.map((b) => b.key),
    async (t): Promise<{ refused: { seconds: number; bucket: Bucket } } | { id: number }> => {
      let wait: { seconds: number; bucket: Bucket } | null = null;
      for (const { bucket, rule, key } of buckets) {
        const since = new Date(now.getTime() - rule.windowMinutes * 60_000);
        const n = await countAttempts(kind, key, since, rules.failuresOnly, t);
        if (n < rule.max) continue;
        const freedAt = await nthNewestAttemptAt(kind, key, since, rules.failuresOnly, rule.max, t);
        const seconds = Math.max(1, freedAt ? Math.ceil((freedAt.getTime() + rule.windowMinutes * 60_000 - now.getTime()) / 1000) : rule.windowMinutes * 60);
        if (!wait || seconds > wait.seconds) wait = { seconds, bucket };
      }
      if (wait !== null) return { refused: wait };
      return { id: await insertAttempt(kind, who.email, who.ip, false, t) };
    },
  );
  // Could not even get the lock: the bucket is under siege, so refuse rather than guess.
  if (!outcome) throw new RateLimitedError(60, rules.message(1, buckets[0]?.bucket ?? 'email'));
  const result = outcome.value;
  if ('refused' in result) {
    const minutes = Math.max(1, Math.ceil(result.refused.seconds / 60));
    throw new RateLimitedError(result.refused.seconds, rules.message(minutes, result.refused.bucket));
  }
  return { id: result.id, kind };
}

/** The attempt worked (right password, account made, reset handled): it is no failure. */
export async function settleAttempt(attempt: Attempt): Promise<void> {
  await markAttemptSucceeded(attempt.id);
}

export async function forgiveAddress(kind: AttemptKind, email: string): Promise<void> {
  await clearEmailFailures(kind, email);
}

/** Attempts older than the widest window count for nothing; sweep them now and then. */
export async function sweepOldAttempts(now = new Date()): Promise<void> {
  const widest = Math.max(...Object.values(THROTTLE_RULES).flatMap((r) => [r.perEmail, r.perIp, r.unknownIp].map((rule) => rule?.windowMinutes ?? 0)));
  await deleteAttemptsOlderThan(new Date(now.getTime() - 2 * widest * 60_000));
}
