import { z } from 'zod';
import { WEBHOOK_EVENTS } from '@/server/webhooks/events';

/** The register-an-endpoint form (settings/webhooks) and the createWebhookEndpoint action. */
export const createWebhookSchema = z.object({
  url: z.string().trim().min(1, 'Enter the address that should receive the events.').max(2000, 'At most 2 000 characters.'),
  description: z.string().trim().min(1, 'Say what receives the events, e.g. "Order system".').max(80, 'At most 80 characters.'),
  // A form sends one checkbox value as a string and several as an array.
  events: z.preprocess(
    (v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : [v]),
    z.array(z.enum(WEBHOOK_EVENTS, { error: `An event is one of ${WEBHOOK_EVENTS.join(', ')}.` })).min(1, 'Choose at least one event.'),
  ).transform((s) => WEBHOOK_EVENTS.filter((e) => s.includes(e))),
});
export type CreateWebhookInput = z.output<typeof createWebhookSchema>;

export const webhookIdSchema = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647) });
