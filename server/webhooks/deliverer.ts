import 'server-only';
import { claimDueDeliveries, recordAttempt, type ClaimedDelivery } from '@/db/queries/webhooks';
import { getEnv } from '@/server/env';
import { decryptSecret } from './secret';
import { safePost, type PostOutcome } from './safe-post';
import { SIGNATURE_HEADER, signatureHeader } from './signature';

/** Attempts before a delivery is given up (the last retry comes about 4 hours after the first try). */
export const MAX_ATTEMPTS = 10;
/** How long a claimed delivery belongs to the process that claimed it (longer than any attempt). */
export const LEASE_MS = 60_000;
const BASE_DELAY_MS = 30_000;
const MAX_DELAY_MS = 2 * 3600_000;

/** Wait after the n-th failed attempt: 30 s, 1 min, 2 min … doubling, at most 2 h (common practice, no source). */
export function retryDelayMs(failedAttempts: number): number {
  return Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, failedAttempts - 1));
}

export type DeliveryRun = { attempted: number; delivered: number; failed: number };

/**
 * One pass of the deliverer: claim due deliveries (SKIP LOCKED, so several processes may run
 * this at once and never send one attempt twice), sign and POST each, record the outcome —
 * delivered, or retried after retryDelayMs, or failed after MAX_ATTEMPTS.
 */
export async function deliverDueWebhooks(opts: { now?: Date; limit?: number; endpointId?: number; allowPrivate?: boolean; timeoutMs?: number } = {}): Promise<DeliveryRun> {
  const now = opts.now ?? new Date();
  const env = getEnv();
  const allowPrivate = opts.allowPrivate ?? env.WEBHOOKS_ALLOW_PRIVATE_TARGETS;
  const claimed = await claimDueDeliveries({ now, leaseMs: LEASE_MS, limit: opts.limit ?? 20, endpointId: opts.endpointId });
  const run: DeliveryRun = { attempted: claimed.length, delivered: 0, failed: 0 };
  await Promise.all(
    claimed.map(async (d) => {
      const outcome = await attempt(d, env.WEBHOOK_SECRET_KEY, allowPrivate, opts.timeoutMs);
      const at = new Date();
      if (outcome.ok) {
        run.delivered++;
        await recordAttempt(d.id, d.attemptCount, { status: 'delivered', responseCode: outcome.status, error: null, nextAttemptAt: null, at });
        return;
      }
      run.failed++;
      const giveUp = d.attemptCount >= MAX_ATTEMPTS;
      await recordAttempt(d.id, d.attemptCount, {
        status: giveUp ? 'failed' : 'pending',
        responseCode: outcome.status,
        error: outcome.error,
        nextAttemptAt: giveUp ? null : new Date(now.getTime() + retryDelayMs(d.attemptCount)),
        at,
      });
    }),
  );
  return run;
}

async function attempt(d: ClaimedDelivery, key: string | undefined, allowPrivate: boolean, timeoutMs?: number): Promise<PostOutcome> {
  let secret: string;
  try {
    if (!key) throw new Error('WEBHOOK_SECRET_KEY is not set');
    secret = decryptSecret(d.secretCiphertext, key);
  } catch {
    return { ok: false, status: null, error: 'The signing secret could not be read (WEBHOOK_SECRET_KEY changed or unset); nothing was sent.' };
  }
  const timestamp = Math.floor(Date.now() / 1000);
  return safePost(
    d.url,
    d.body,
    { [SIGNATURE_HEADER]: signatureHeader(secret, timestamp, d.body), 'FadeLedger-Event': d.eventType, 'FadeLedger-Event-Id': d.eventId, 'FadeLedger-Attempt': String(d.attemptCount) },
    { allowPrivate, timeoutMs },
  );
}

const holder = globalThis as unknown as { __fadeledgerWebhookTimer?: NodeJS.Timeout };

/**
 * Runs the deliverer every WEBHOOK_DELIVERY_INTERVAL_MS (5 s) in this process (instrumentation.ts). Keeps only the timer:
 * which deliveries are due, claimed or done lives in MariaDB, so any number of app processes can
 * run it and a restart loses nothing. A failed pass (database down) is retried on the next tick.
 */
export function startWebhookDeliverer(intervalMs = getEnv().WEBHOOK_DELIVERY_INTERVAL_MS): void {
  if (holder.__fadeledgerWebhookTimer || intervalMs <= 0) return;
  let running = false;
  holder.__fadeledgerWebhookTimer = setInterval(() => {
    if (running) return;
    running = true;
    deliverDueWebhooks()
      .catch((e) => console.error('webhook deliverer:', (e as Error).message))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  holder.__fadeledgerWebhookTimer.unref();
}
