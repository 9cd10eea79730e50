import type Stripe from 'stripe';
import { SUBSCRIPTION_STATUSES, type SubscriptionStatus } from '@/db/models/subscription';

/**
 * The provider's objects converted to our own shapes where they come in, so the rest of billing
 * never reads Stripe field names (and an API-version change is fixed here only).
 */
export interface ProviderSubscription {
  id: string;
  customerId: string;
  status: SubscriptionStatus;
  priceId: string | null;
  productId: string | null;
  currentPeriodEnd: Date | null;
  /** Ends at the period end unless renewed (cancel_at_period_end, or a cancel_at date). */
  cancelAtPeriodEnd: boolean;
  canceledAt: Date | null;
  endedAt: Date | null;
  metadata: Record<string, string>;
}

export interface ProviderCheckoutSession {
  id: string;
  customerId: string | null;
  subscriptionId: string | null;
  clientReferenceId: string | null;
  status: 'open' | 'complete' | 'expired';
  metadata: Record<string, string>;
}

export interface ProviderInvoice {
  id: string;
  customerId: string | null;
  subscriptionId: string | null;
  status: string | null;
}

const fromUnix = (s: number | null | undefined): Date | null => (typeof s === 'number' && s > 0 ? new Date(s * 1000) : null);
const idOf = (v: string | { id: string } | null | undefined): string | null => (v == null ? null : typeof v === 'string' ? v : v.id);

export function reshapeSubscription(s: Stripe.Subscription): ProviderSubscription {
  if (!(SUBSCRIPTION_STATUSES as readonly string[]).includes(s.status)) {
    throw new Error(`Unknown subscription status "${s.status}" from the payment provider.`);
  }
  // Since API 2025-03-31 the period is on each item only; the subscription-level
  // current_period_end is gone from the API version the SDK pins (and the webhook endpoint must
  // use the same version), so it is not read even when an older payload carries it.
  const item = s.items?.data?.[0];
  return {
    id: s.id,
    customerId: idOf(s.customer) as string,
    status: s.status as SubscriptionStatus,
    priceId: item?.price?.id ?? null,
    productId: idOf(item?.price?.product as string | { id: string } | undefined),
    currentPeriodEnd: fromUnix(item?.current_period_end),
    cancelAtPeriodEnd: Boolean(s.cancel_at_period_end) || (s.cancel_at != null && s.status !== 'canceled'),
    canceledAt: fromUnix(s.canceled_at),
    endedAt: fromUnix(s.ended_at),
    metadata: { ...(s.metadata ?? {}) },
  };
}

export function reshapeCheckoutSession(s: Stripe.Checkout.Session): ProviderCheckoutSession {
  return {
    id: s.id,
    customerId: idOf(s.customer as string | { id: string } | null),
    subscriptionId: idOf(s.subscription as string | { id: string } | null),
    clientReferenceId: s.client_reference_id ?? null,
    status: (s.status ?? 'open') as ProviderCheckoutSession['status'],
    metadata: { ...(s.metadata ?? {}) },
  };
}

export function reshapeInvoice(i: Stripe.Invoice): ProviderInvoice {
  // API 2025+: the subscription sits under parent.subscription_details; before, at the top.
  const legacy = (i as unknown as { subscription?: string | { id: string } | null }).subscription;
  const sub = i.parent?.subscription_details?.subscription ?? legacy ?? null;
  return {
    id: i.id as string,
    customerId: idOf(i.customer as string | { id: string } | null),
    subscriptionId: idOf(sub as string | { id: string } | null),
    status: i.status ?? null,
  };
}
