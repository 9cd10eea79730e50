import 'server-only';
import { RateLimitedError } from '@/server/errors';
import type { AttemptKind } from '@/db/models/sign-in-attempt';
import { countAttempts, nthNewestAttemptAt, insertAttempt, clearEmailFailures, deleteAttemptsOlderThan } from '@/db/queries/throttle';

type Rule = { max: number; windowMinutes: number };
type DoorRules = { perEmail?: Rule; perIp?: Rule; failuresOnly: boolean; message: (minutes: number) => string };

/**
 * Throttles, kept in MariaDB so every app instance sees the same counts. Limits are common
 * practice, no source: a handful of wrong passwords per address, a wider allowance per IP
 * (offices share one), and few reset mails per address so nobody can flood an inbox.
 */
export const THROTTLE_RULES: Record<AttemptKind, DoorRules> = {
  sign_in: {
    perEmail: { max: 5, windowMinutes: 15 },
    perIp: { max: 30, windowMinutes: 15 },
    failuresOnly: true,
    message: (m) => `Too many sign-in attempts. Try again in ${m} ${m === 1 ? 'minute' : 'minutes'}.`,
  },
  reset_request: {
    perEmail: { max: 3, windowMinutes: 60 },
    perIp: { max: 20, windowMinutes: 60 },
    failuresOnly: false,
    message: (m) => `Too many reset requests. Try again in ${m} ${m === 1 ? 'minute' : 'minutes'}.`,
  },
  sign_up: {
    perIp: { max: 10, windowMinutes: 60 },
    failuresOnly: false,
    message: (m) => `Too many new accounts from this network. Try again in ${m} ${m === 1 ? 'minute' : 'minutes'}.`,
  },
};

/** Throws RateLimitedError (with minutes to wait) when the address or the IP is over its limit. */
export async function assertNotThrottled(kind: AttemptKind, who: { email: string | null; ip: string | null }, now = new Date()): Promise<void> {
  const rules = THROTTLE_RULES[kind];
  let waitSeconds = 0;
  const check = async (rule: Rule | undefined, key: { email?: string; ip?: string }) => {
    if (!rule) return;
    const since = new Date(now.getTime() - rule.windowMinutes * 60_000);
    const n = await countAttempts(kind, key, since, rules.failuresOnly);
    if (n < rule.max) return;
    const freedAt = await nthNewestAttemptAt(kind, key, since, rules.failuresOnly, rule.max);
    const seconds = freedAt ? Math.ceil((freedAt.getTime() + rule.windowMinutes * 60_000 - now.getTime()) / 1000) : rule.windowMinutes * 60;
    waitSeconds = Math.max(waitSeconds, seconds, 1);
  };
  if (who.email) await check(rules.perEmail, { email: who.email });
  if (who.ip) await check(rules.perIp, { ip: who.ip });
  if (waitSeconds > 0) {
    const minutes = Math.max(1, Math.ceil(waitSeconds / 60));
    throw new RateLimitedError(waitSeconds, rules.message(minutes));
  }
}

export async function recordAttempt(kind: AttemptKind, who: { email: string | null; ip: string | null }, succeeded: boolean): Promise<void> {
  await insertAttempt(kind, who.email, who.ip, succeeded);
}

export async function forgiveAddress(kind: AttemptKind, email: string): Promise<void> {
  await clearEmailFailures(kind, email);
}

/** Attempts older than the widest window count for nothing; sweep them now and then. */
export async function sweepOldAttempts(now = new Date()): Promise<void> {
  const widest = Math.max(...Object.values(THROTTLE_RULES).flatMap((r) => [r.perEmail?.windowMinutes ?? 0, r.perIp?.windowMinutes ?? 0]));
  await deleteAttemptsOlderThan(new Date(now.getTime() - 2 * widest * 60_000));
}
