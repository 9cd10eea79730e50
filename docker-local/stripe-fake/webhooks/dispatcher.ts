// Records every event and posts it to the app's webhook endpoint, signed. Deliveries run one
// after another in creation order (async, never blocking the API reply); a failed delivery is
// retried later with backoff, so after a failure the app sees events out of order, as with Stripe.
import { newId, nowSeconds } from '../state/ids';
import type { StripeEvent } from '../objects/types';
import { signatureHeader } from './sign';

export interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
  duration_ms: number;
}

export type DeliveryStatus = 'pending' | 'delivered' | 'failed' | 'no_endpoint';

export interface EventRecord {
  event: StripeEvent;
  status: DeliveryStatus;
  attempts: DeliveryAttempt[];
}

export interface DispatcherOptions {
  webhookUrl: string | null;
  webhookSecret: string;
  apiVersion: string;
  /** Waits before each retry; the number of entries is the number of retries. */
  retryDelaysMs: number[];
  timeoutMs: number;
  log: (line: string) => void;
}

export class Dispatcher {
  private records = new Map<string, EventRecord>();
  private order: string[] = [];
  private queue: Promise<void> = Promise.resolve();
  private timers = new Set<NodeJS.Timeout>();
  /** Bumped by reset/close so deliveries queued before it are dropped. */
  private generation = 0;
  /** `created` of the newest event so far (see nextCreated). */
  private lastCreated = 0;

  constructor(private readonly options: DispatcherOptions) {}

  /**
   * Each event gets a later second than the one before it. A flow emits several events at once
   * (created, invoice events, updated), and a receiver orders a subscription's events by `created`:
   * within one second it could not tell which came last. A burst therefore runs a few seconds
   * ahead of the wall clock, as if the flow had taken that long; it is never behind it. Kept across
   * reset, so events after a reset never look older than those before it.
   */
  private nextCreated(): number {
    this.lastCreated = Math.max(nowSeconds(), this.lastCreated + 1);
    return this.lastCreated;
  }

  emit(type: string, object: object, previousAttributes?: Record<string, unknown>, requestId: string | null = null): StripeEvent {
    const event: StripeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: this.options.apiVersion,
      created: this.nextCreated(),
      // A snapshot: later changes to the object must not alter an event already sent.
      data: previousAttributes
        ? { object: structuredClone(object), previous_attributes: structuredClone(previousAttributes) }
        : { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.options.webhookUrl ? 1 : 0,
      request: { id: requestId, idempotency_key: null },
      type,
    };
    const record: EventRecord = { event, status: this.options.webhookUrl ? 'pending' : 'no_endpoint', attempts: [] };
    this.records.set(event.id, record);
    this.order.push(event.id);
    if (this.options.webhookUrl) this.enqueue(record, 0);
    return event;
  }

  /** Sends an already delivered event again (same id), as the Dashboard's "Resend" does. */
  resend(id: string): EventRecord | undefined {
    const record = this.records.get(id);
    if (!record) return undefined;
    if (this.options.webhookUrl) {
      record.status = 'pending';
      record.event.pending_webhooks = 1;
      this.enqueue(record, 0);
    }
    return record;
  }

  get(id: string): EventRecord | undefined {
    return this.records.get(id);
  }

  /** Newest first, like Stripe lists. */
  list(): EventRecord[] {
    return [...this.order].reverse().map((id) => this.records.get(id) as EventRecord);
  }

  /** Resolves when nothing is queued or waiting for a retry. */
  async idle(): Promise<void> {
    for (;;) {
      const queued = this.queue;
      await queued;
      if (queued === this.queue && this.timers.size === 0) return;
      if (this.timers.size > 0) await new Promise((r) => setTimeout(r, 20));
    }
  }

  reset(): void {
    this.generation++;
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    this.records.clear();
    this.order = [];
  }

  private enqueue(record: EventRecord, retriesDone: number): void {
    const generation = this.generation;
    this.queue = this.queue.then(async () => {
      if (generation !== this.generation) return;
      const ok = await this.attempt(record);
      if (generation !== this.generation) return;
      if (ok) {
        record.status = 'delivered';
        record.event.pending_webhooks = 0;
        return;
      }
      const delay = this.options.retryDelaysMs[retriesDone];
      if (delay === undefined) {
        record.status = 'failed';
        this.options.log(`webhook ${record.event.type} ${record.event.id} failed after ${record.attempts.length} attempts`);
        return;
      }
      const timer = setTimeout(() => {
        this.timers.delete(timer);
        if (generation === this.generation) this.enqueue(record, retriesDone + 1);
      }, delay);
      this.timers.add(timer);
    });
  }

  private async attempt(record: EventRecord): Promise<boolean> {
    const url = this.options.webhookUrl as string;
    const payload = JSON.stringify(record.event, null, 2);
    const started = Date.now();
    const attempt: DeliveryAttempt = { at: nowSeconds(), status: null, error: null, duration_ms: 0 };
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signatureHeader(payload, this.options.webhookSecret, nowSeconds()),
          'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: AbortSignal.timeout(this.options.timeoutMs),
        redirect: 'manual',
      });
      attempt.status = response.status;
      // Drain the body so the socket is released.
      await response.arrayBuffer().catch(() => undefined);
      return response.status >= 200 && response.status < 300;
    } catch (error) {
      attempt.error = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
      return false;
    } finally {
      attempt.duration_ms = Date.now() - started;
      record.attempts.push(attempt);
    }
  }
}
