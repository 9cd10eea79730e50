/**
 * Billing rules as data, read by limits, webhooks and the billing pages.
 *
 * Grace period: a product decision of ours (common practice, no source) — long enough for the
 * provider's automatic retries and for an admin to update a card, short enough that an unpaid
 * account does not keep paid limits for a whole period.
 */
export const PAST_DUE_GRACE_DAYS = 7;

/** Plans are sold monthly in US dollars; prices are stored as decimal strings. */
export const BILLING_CURRENCY = 'usd';
export const BILLING_INTERVAL = 'month' as const;

/** Statuses in which the provider still expects payment and the subscription counts as live. */
export const LIVE_STATUSES = ['trialing', 'active', 'past_due', 'unpaid', 'paused'] as const;

/** Statuses in which the paid plan's limits hold only until the grace period ends. */
export const OVERDUE_STATUSES = ['past_due', 'unpaid'] as const;

/** Terminal: the provider never moves a subscription out of these. */
export const ENDED_STATUSES = ['canceled', 'incomplete_expired'] as const;

export function graceEndFrom(pastDueSince: Date): Date {
  return new Date(pastDueSince.getTime() + PAST_DUE_GRACE_DAYS * 86_400_000);
}
