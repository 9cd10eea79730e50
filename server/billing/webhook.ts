import 'server-only';
import type Stripe from 'stripe';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import { getEnv } from '@/server/env';
import { AppError } from '@/server/errors';
import { applyCheckoutCompleted, applyCheckoutExpired } from './apply-checkout';
import { applyInvoiceEvent } from './apply-invoice';
import { applySubscription, type ApplyOutcome } from './apply-subscription';
import { reshapeCheckoutSession, reshapeInvoice, reshapeSubscription } from './provider-objects';
import { getStripe } from './stripe';

/** The event types we act on; anything else is acknowledged (200) and not stored. */
export const HANDLED_EVENT_TYPES = [
  'checkout.session.completed',
  'checkout.session.expired',
  'customer.subscription.created',
  'customer.subscription.updated',
  'customer.subscription.deleted',
  'customer.subscription.paused',
  'customer.subscription.resumed',
  'invoice.paid',
  'invoice.payment_failed',
] as const;
export type HandledEventType = (typeof HANDLED_EVENT_TYPES)[number];

export function isHandledEventType(type: string): type is HandledEventType {
  return (HANDLED_EVENT_TYPES as readonly string[]).includes(type);
}

/** Seconds a signature stays valid: Stripe's own default tolerance, against replayed requests. */
export const SIGNATURE_TOLERANCE_SECONDS = 300;

export class WebhookSignatureError extends AppError {
  constructor() {
    super('The webhook signature is missing, does not match, or is too old.', 400, 'invalid_signature');
  }
}

/** Verifies the Stripe-Signature header over the raw body with our webhook secret. */
export function verifyWebhook(rawBody: string, signatureHeader: string | null): Stripe.Event {
  if (!signatureHeader) throw new WebhookSignatureError();
  try {
    return getStripe().webhooks.constructEvent(rawBody, signatureHeader, getEnv().STRIPE_WEBHOOK_SECRET, SIGNATURE_TOLERANCE_SECONDS);
  } catch {
    throw new WebhookSignatureError();
  }
}

async function applyEvent(event: Stripe.Event, t: Transaction): Promise<ApplyOutcome> {
  const object = event.data.object as unknown;
  switch (event.type as HandledEventType) {
    case 'customer.subscription.created':
    case 'customer.subscription.updated':
    case 'customer.subscription.deleted':
    case 'customer.subscription.paused':
    case 'customer.subscription.resumed':
      return applySubscription(reshapeSubscription(object as Stripe.Subscription), event.created, t);
    case 'checkout.session.completed':
      return applyCheckoutCompleted(reshapeCheckoutSession(object as Stripe.Checkout.Session), event.created, t);
    case 'checkout.session.expired':
      return applyCheckoutExpired(reshapeCheckoutSession(object as Stripe.Checkout.Session), t);
    case 'invoice.paid':
      return applyInvoiceEvent('paid', reshapeInvoice(object as Stripe.Invoice), event.created, t);
    case 'invoice.payment_failed':
      return applyInvoiceEvent('payment_failed', reshapeInvoice(object as Stripe.Invoice), event.created, t);
  }
}

export type ReceiveResult = { outcome: ApplyOutcome | 'duplicate'; eventId: string };

const DEADLOCK = /ER_LOCK_DEADLOCK|Deadlock found|ER_LOCK_WAIT_TIMEOUT/;

/**
 * Stores the event by its provider id and applies it exactly once. The receipt row and the
 * event's effect commit together: a redelivery (or a parallel delivery, which waits on the row
 * lock) finds it processed and changes nothing; a failure rolls both back so the provider's retry
 * applies it afresh. Deadlocks between parallel deliveries are retried here a few times.
 */
export async function receiveWebhookEvent(event: Stripe.Event): Promise<ReceiveResult> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await receiveOnce(event);
    } catch (error) {
      const text = `${(error as { name?: string }).name ?? ''} ${(error as Error).message ?? ''} ${(error as { original?: { code?: string } }).original?.code ?? ''}`;
      if (attempt < 3 && DEADLOCK.test(text)) continue;
      await recordFailure(event, error).catch(() => undefined);
      throw error;
    }
  }
}

async function receiveOnce(event: Stripe.Event): Promise<ReceiveResult> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    await sequelize.query(
      `INSERT INTO webhook_events (provider_event_id, type, event_created, payload, delivery_count, received_at, updated_at)
       VALUES (:id, :type, :created, :payload, 1, NOW(), NOW())
       ON DUPLICATE KEY UPDATE delivery_count = delivery_count + 1, updated_at = NOW()`,
      { replacements: { id: event.id, type: event.type, created: event.created, payload: JSON.stringify(event) }, transaction: t },
    );
    const [row] = await sequelize.query<{ id: number; processed_at: Date | null }>(
      'SELECT id, processed_at FROM webhook_events WHERE provider_event_id = :id FOR UPDATE',
      { replacements: { id: event.id }, type: QueryTypes.SELECT, transaction: t },
    );
    if (row.processed_at) return { outcome: 'duplicate' as const, eventId: event.id };
    const outcome = await applyEvent(event, t);
    await sequelize.query('UPDATE webhook_events SET processed_at = NOW(), outcome = :outcome, last_error = NULL WHERE id = :rowId', {
      replacements: { outcome, rowId: row.id },
      transaction: t,
    });
    return { outcome, eventId: event.id };
  });
}

/** Keeps a trace of a failed attempt (unprocessed), outside the rolled-back transaction. */
async function recordFailure(event: Stripe.Event, error: unknown): Promise<void> {
  const { sequelize } = models();
  const message = (error instanceof Error ? `${error.name}: ${error.message}` : String(error)).slice(0, 1000);
  await sequelize.query(
    `INSERT INTO webhook_events (provider_event_id, type, event_created, payload, delivery_count, last_error, received_at, updated_at)
     VALUES (:id, :type, :created, :payload, 1, :message, NOW(), NOW())
     ON DUPLICATE KEY UPDATE delivery_count = delivery_count + 1, last_error = IF(processed_at IS NULL, :message, last_error), updated_at = NOW()`,
    { replacements: { id: event.id, type: event.type, created: event.created, payload: JSON.stringify(event), message } },
  );
}
