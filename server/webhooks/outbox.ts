import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { insertOutboxRows } from '@/db/queries/webhooks';
import type { AnyWebhookEventType, WebhookEnvelope } from './events';

/**
 * Queues an event for the company's endpoints that want it, in the transaction of the change that
 * causes it (the transaction is required on purpose): a rolled-back change queues nothing, and a
 * committed one is delivered even if the process stops right after. The body is built now and
 * sent unchanged on every attempt. Returns the event id and how many deliveries were queued.
 */
export async function enqueueWebhookEvent(
  companyId: number,
  type: AnyWebhookEventType,
  data: Record<string, unknown>,
  t: Transaction,
  opts: { onlyEndpointId?: number; now?: Date } = {},
): Promise<{ eventId: string; queued: number }> {
  const eventId = `evt_${randomUUID()}`;
  const envelope: WebhookEnvelope = { id: eventId, type, createdAt: (opts.now ?? new Date()).toISOString(), company: { id: companyId }, data };
  const queued = await insertOutboxRows({ companyId, eventId, eventType: type, body: JSON.stringify(envelope), onlyEndpointId: opts.onlyEndpointId }, t);
  return { eventId, queued };
}
