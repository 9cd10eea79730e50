// Subscription lifecycle shared by the API, the hosted pages and the /_fake test hooks, so a
// plan change from the portal page and one through the SDK produce the same state and events.
import type { FakeContext } from '../context';
import { StripeApiError, noSuch } from '../http/errors';
import { makeInvoice, markFailed, markPaid } from '../objects/billing';
import { periodSeconds } from '../objects/catalog';
import { previousAttributes } from '../objects/diff';
import type { BillingReason, Customer, Invoice, Price, Subscription } from '../objects/types';
import { nowSeconds } from '../state/ids';

export function customerOf(ctx: FakeContext, subscription: Subscription): Customer {
  const customer = ctx.store.customers.get(subscription.customer);
  if (!customer) throw noSuch('cus', subscription.customer, 'customer');
  return customer;
}

/** Applies a change and sends `customer.subscription.updated` if anything moved. */
export function changeSubscription(ctx: FakeContext, subscription: Subscription, apply: () => void, requestId: string | null = null): void {
  const before = structuredClone(subscription);
  apply();
  const previous = previousAttributes(before, subscription);
  if (Object.keys(previous).length > 0) {
    ctx.events.emit('customer.subscription.updated', subscription, previous, requestId);
  }
}

export function assertNotCanceled(subscription: Subscription): void {
  if (subscription.status === 'canceled' || subscription.status === 'incomplete_expired') {
    throw new StripeApiError(400, `A canceled subscription can only update its cancellation_details and metadata (${subscription.id}).`, {
      code: 'resource_missing',
    });
  }
}

export function assertUsablePrice(price: Price, subscription: Subscription | null, param: string): void {
  if (!price.active) {
    throw new StripeApiError(400, `The price specified is inactive. This field only accepts active prices. (${price.id})`, { param });
  }
  if (!price.recurring) {
    throw new StripeApiError(400, `The price specified is set to \`type=one_time\` but this field only accepts prices with \`type=recurring\`.`, { param });
  }
  if (subscription && price.currency !== subscription.currency) {
    throw new StripeApiError(400, `The price specified has currency ${price.currency}, but this subscription uses ${subscription.currency}.`, { param });
  }
}

function setPeriod(subscription: Subscription, start: number, end: number): void {
  subscription.current_period_start = start;
  subscription.current_period_end = end;
  for (const item of subscription.items.data) {
    item.current_period_start = start;
    item.current_period_end = end;
  }
  if (subscription.cancel_at_period_end) subscription.cancel_at = end;
}

function nextPeriodLength(subscription: Subscription): number {
  return periodSeconds(subscription.items.data[0].price);
}

function issueInvoice(ctx: FakeContext, subscription: Subscription, reason: BillingReason, free: boolean): Invoice {
  const invoice = makeInvoice(customerOf(ctx, subscription), subscription, reason, free);
  ctx.store.invoices.set(invoice.id, invoice);
  ctx.store.track(invoice.id);
  subscription.latest_invoice = invoice.id;
  return invoice;
}

/** Invoice for a newly created subscription; paid at once (the test card always succeeds). */
export function chargeFirstInvoice(ctx: FakeContext, subscription: Subscription): Invoice {
  const invoice = issueInvoice(ctx, subscription, 'subscription_create', subscription.status === 'trialing');
  markPaid(invoice);
  return invoice;
}

function endSubscription(ctx: FakeContext, subscription: Subscription, endedAt: number, reason: string, requestId: string | null): void {
  subscription.status = 'canceled';
  subscription.canceled_at = subscription.canceled_at ?? nowSeconds();
  subscription.ended_at = endedAt;
  subscription.cancel_at = null;
  subscription.cancellation_details = { ...subscription.cancellation_details, reason };
  ctx.events.emit('customer.subscription.deleted', subscription, undefined, requestId);
}

export function cancelNow(ctx: FakeContext, subscription: Subscription, requestId: string | null = null): void {
  if (subscription.status === 'canceled') {
    throw new StripeApiError(404, `No such subscription: '${subscription.id}'`, { code: 'resource_missing', param: 'id' });
  }
  endSubscription(ctx, subscription, nowSeconds(), 'cancellation_requested', requestId);
}

/**
 * The renewal at the end of the current period is declined: the period moves on, the new
 * invoice stays open and the subscription goes past_due. A repeat while past_due is one more
 * failed retry of the same invoice.
 */
export function failRenewal(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  if (subscription.status === 'past_due' && subscription.latest_invoice) {
    const open = ctx.store.invoices.get(subscription.latest_invoice);
    if (open && open.status === 'open') {
      markFailed(open);
      ctx.events.emit('invoice.payment_failed', open);
      return open;
    }
  }
  if (subscription.cancel_at_period_end) {
    throw new StripeApiError(400, 'This subscription is set to cancel at period end, so no renewal is charged; use /advance instead.');
  }
  let invoice: Invoice | undefined;
  changeSubscription(ctx, subscription, () => {
    const start = subscription.current_period_end;
    setPeriod(subscription, start, start + nextPeriodLength(subscription));
    subscription.status = 'past_due';
    invoice = issueInvoice(ctx, subscription, 'subscription_cycle', false);
    markFailed(invoice);
    customerOf(ctx, subscription).delinquent = true;
    ctx.events.emit('invoice.payment_failed', invoice);
  });
  return invoice as Invoice;
}

/** The customer pays the open invoice (test card succeeds): back to active. */
export function payOpenInvoice(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  const invoice = subscription.latest_invoice ? ctx.store.invoices.get(subscription.latest_invoice) : undefined;
  if (!invoice || invoice.status !== 'open') {
    throw new StripeApiError(400, `Subscription ${subscription.id} has no open invoice to pay.`);
  }
  changeSubscription(ctx, subscription, () => {
    markPaid(invoice);
    subscription.status = 'active';
    customerOf(ctx, subscription).delinquent = false;
    ctx.events.emit('invoice.paid', invoice);
  });
  return invoice;
}

/** A declined retry of the open invoice: the subscription stays past_due. */
export function declineOpenInvoice(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  const invoice = subscription.latest_invoice ? ctx.store.invoices.get(subscription.latest_invoice) : undefined;
  if (!invoice || invoice.status !== 'open') {
    throw new StripeApiError(400, `Subscription ${subscription.id} has no open invoice to pay.`);
  }
  markFailed(invoice);
  ctx.events.emit('invoice.payment_failed', invoice);
  return invoice;
}

/**
 * The current period ends. Cancel-at-period-end → canceled; past_due → canceled (Stripe's
 * default when retries are exhausted); trialing or active → renewed with a paid invoice.
 */
export function advancePeriod(ctx: FakeContext, subscription: Subscription): void {
  assertNotCanceled(subscription);
  if (subscription.cancel_at_period_end) {
    endSubscription(ctx, subscription, subscription.current_period_end, 'cancellation_requested', null);
    return;
  }
  if (subscription.status === 'past_due' || subscription.status === 'unpaid') {
    endSubscription(ctx, subscription, subscription.current_period_end, 'payment_failed', null);
    return;
  }
  changeSubscription(ctx, subscription, () => {
    const start = subscription.current_period_end;
    setPeriod(subscription, start, start + nextPeriodLength(subscription));
    subscription.status = 'active';
    const invoice = issueInvoice(ctx, subscription, 'subscription_cycle', false);
    markPaid(invoice);
    ctx.events.emit('invoice.paid', invoice);
  });
}
