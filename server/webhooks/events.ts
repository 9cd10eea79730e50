/**
 * The events a webhook endpoint can subscribe to, as data (the settings form, the validation and
 * the outbox read this list). `webhook.test` is only ever sent by "Send test event".
 */
export const WEBHOOK_EVENTS = ['quote.viewed', 'quote.accepted', 'quote.declined', 'study.created'] as const;
export type WebhookEventType = (typeof WEBHOOK_EVENTS)[number];
export type AnyWebhookEventType = WebhookEventType | 'webhook.test';

export const WEBHOOK_EVENT_LABELS: Readonly<Record<WebhookEventType, string>> = {
  'quote.viewed': 'the customer first opened the quote’s comparison link',
  'quote.accepted': 'the customer accepted the quote',
  'quote.declined': 'the customer declined the quote',
  'study.created': 'a study was made (or re-run as a new revision)',
};

/** The JSON body every delivery carries; `data` depends on `type`. */
export type WebhookEnvelope = {
  id: string;
  type: AnyWebhookEventType;
  createdAt: string;
  company: { id: number };
  data: Record<string, unknown>;
};

/** Events as stored (comma-separated) back to the list; unknown names are dropped. */
export function parseWebhookEvents(stored: string): WebhookEventType[] {
  const names = stored.split(',').map((s) => s.trim());
  return WEBHOOK_EVENTS.filter((e) => names.includes(e));
}
