/**
 * The quote lifecycle, in one place: draft → sent → viewed → accepted | declined, or expired when
 * the validity day passes first. Every check of "which statuses" reads these lists. Pure.
 */
export const QUOTE_STATUSES = ['draft', 'sent', 'viewed', 'accepted', 'declined', 'expired'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

/** With the customer, who may still decide (and which expire when the validity day passes). */
export const OPEN_STATUSES = ['sent', 'viewed'] as const satisfies readonly QuoteStatus[];
/** The customer has answered. */
export const DECIDED_STATUSES = ['accepted', 'declined'] as const satisfies readonly QuoteStatus[];
export type DecidedStatus = (typeof DECIDED_STATUSES)[number];
/** Links may be made and e-mails sent: before the customer decides or the quote expires. */
const SHAREABLE_STATUSES: readonly QuoteStatus[] = ['draft', ...OPEN_STATUSES];

const among = (list: readonly QuoteStatus[], status: QuoteStatus) => list.includes(status);

export function isOpen(status: QuoteStatus): boolean {
  return among(OPEN_STATUSES, status);
}

export function isDecided(status: QuoteStatus): status is DecidedStatus {
  return among(DECIDED_STATUSES, status);
}

/** Status words shown to the team (the customer sees sentences of their own). */
export const QUOTE_STATUS_LABELS: Record<QuoteStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  viewed: 'Viewed',
  accepted: 'Accepted',
  declined: 'Declined',
  expired: 'Expired',
};

/** Today's date in UTC as YYYY-MM-DD: validity dates are whole UTC days. */
export function utcDay(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** A quote is valid through the whole of its valid_until day (UTC) and expired from the next. */
export function isPastValidity(validUntil: string, now: Date = new Date()): boolean {
  return utcDay(now) > validUntil;
}

/**
 * The status to show: a sent or viewed quote past its validity is expired even before anything
 * wrote that down (expireOverdueQuotes records it on the next read).
 */
export function effectiveStatus(status: QuoteStatus, validUntil: string, now: Date = new Date()): QuoteStatus {
  if (isOpen(status) && isPastValidity(validUntil, now)) return 'expired';
  return status;
}

/** Only drafts may be edited or deleted: once a customer may have seen a quote, it stays as sent. */
export function isEditable(status: QuoteStatus): boolean {
  return status === 'draft';
}

export function isShareable(status: QuoteStatus): boolean {
  return among(SHAREABLE_STATUSES, status);
}

/** Quote number as people say it: Q-0042. */
export function quoteReference(number: number): string {
  return `Q-${String(number).padStart(4, '0')}`;
}

/** YYYY-MM-DD + n days (UTC). */
export function addDays(day: string, n: number): string {
  const d = new Date(`${day}T00:00:00.000Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return utcDay(d);
}
