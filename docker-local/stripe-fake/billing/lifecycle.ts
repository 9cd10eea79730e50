// Subscription lifecycle shared by the API, the hosted pages and the /_fake test hooks, so a
// plan change from the portal page and one through the SDK produce the same state and events.
// Each flow sends the events Stripe sends for it, in Stripe's usual order: an invoice is created
// as a draft (invoice.created), finalized (invoice.finalized) and then paid (invoice.paid,
// invoice.payment_succeeded) or not (invoice.payment_failed); a status or period change is a
// customer.subscription.updated with previous_attributes.
import type { FakeContext } from '../context';
import { StripeApiError, noSuch } from '../http/errors';
import { finalize, makeInvoice, markFailed, markPaid, periodOf } from '../objects/billing';
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
  for (const item of subscription.items.data) {
    item.current_period_start = start;
    item.current_period_end = end;
  }
  if (subscription.cancel_at_period_end) subscription.cancel_at = end;
}

function nextPeriodLength(subscription: Subscription): number {
  return periodSeconds(subscription.items.data[0].price);
}

/** A draft invoice for the current period, stored and made the latest; announced by `issue`. */
function draftInvoice(ctx: FakeContext, subscription: Subscription, reason: BillingReason, free: boolean): Invoice {
  const invoice = makeInvoice(customerOf(ctx, subscription), subscription, reason, free);
  ctx.store.invoices.set(invoice.id, invoice);
  ctx.store.track(invoice.id);
  subscription.latest_invoice = invoice.id;
  return invoice;
}

/** invoice.created (the draft), then finalization: invoice.finalized (open, numbered). */
function issue(ctx: FakeContext, subscription: Subscription, invoice: Invoice): void {
  ctx.events.emit('invoice.created', invoice);
  finalize(invoice, customerOf(ctx, subscription));
  ctx.events.emit('invoice.finalized', invoice);
}

/** The test card succeeds: invoice.paid and invoice.payment_succeeded, as Stripe sends both. */
function collectPaid(ctx: FakeContext, invoice: Invoice): void {
  markPaid(invoice);
  ctx.events.emit('invoice.paid', invoice);
  ctx.events.emit('invoice.payment_succeeded', invoice);
}

function collectFailed(ctx: FakeContext, invoice: Invoice): void {
  markFailed(invoice);
  ctx.events.emit('invoice.payment_failed', invoice);
}

/**
 * A subscription just made by Checkout (already stored). Without a trial it starts `incomplete`
 * and becomes `active` once its first invoice is paid, so the app sees
 * customer.subscription.created (incomplete), the invoice's events, then
 * customer.subscription.updated (active, previous status incomplete). With a trial it starts
 * `trialing` with a paid zero invoice and no update.
 */
export function startSubscription(ctx: FakeContext, subscription: Subscription): Invoice {
  const trial = subscription.status === 'trialing';
  const invoice = draftInvoice(ctx, subscription, 'subscription_create', trial);
  ctx.events.emit('customer.subscription.created', subscription);
  issue(ctx, subscription, invoice);
  collectPaid(ctx, invoice);
  if (!trial) changeSubscription(ctx, subscription, () => (subscription.status = 'active'));
  return invoice;
}

function endSubscription(ctx: FakeContext, subscription: Subscription, endedAt: number, reason: string, requestId: string | null): void {
  subscription.status = 'canceled';
  subscription.canceled_at = subscription.canceled_at ?? nowSeconds();
  subscription.ended_at = endedAt;
  subscription.cancel_at = null;
  subscription.cancellation_details = { ...subscription.cancellation_details, reason };
  delete subscription.status_details;
  ctx.events.emit('customer.subscription.deleted', subscription, undefined, requestId);
}

export function cancelNow(ctx: FakeContext, subscription: Subscription, requestId: string | null = null): void {
  if (subscription.status === 'canceled') {
    throw new StripeApiError(404, `No such subscription: '${subscription.id}'`, { code: 'resource_missing', param: 'id' });
  }
  endSubscription(ctx, subscription, nowSeconds(), 'cancellation_requested', requestId);
}

/** The next period begins (customer.subscription.updated) with a draft invoice for it. */
function startNextPeriod(ctx: FakeContext, subscription: Subscription): Invoice {
  let invoice: Invoice | undefined;
  changeSubscription(ctx, subscription, () => {
    const start = periodOf(subscription).end;
    setPeriod(subscription, start, start + nextPeriodLength(subscription));
    // A trial ends with its period: from here the subscription is paid for.
    if (subscription.status === 'trialing') subscription.status = 'active';
    invoice = draftInvoice(ctx, subscription, 'subscription_cycle', false);
  });
  return invoice as Invoice;
}

/**
 * The renewal at the end of the current period is declined: the period moves on, the new
 * invoice is issued and its payment fails, and the subscription goes past_due (a second
 * customer.subscription.updated). A repeat while past_due is one more failed retry of the same
 * invoice.
 */
export function failRenewal(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  if (subscription.status === 'past_due' && subscription.latest_invoice) {
    const open = ctx.store.invoices.get(subscription.latest_invoice);
    if (open && open.status === 'open') {
      collectFailed(ctx, open);
      return open;
    }
  }
  if (subscription.cancel_at_period_end) {
    throw new StripeApiError(400, 'This subscription is set to cancel at period end, so no renewal is charged; use /advance instead.');
  }
  assertRenews(subscription);
  const invoice = startNextPeriod(ctx, subscription);
  issue(ctx, subscription, invoice);
  collectFailed(ctx, invoice);
  changeSubscription(ctx, subscription, () => {
    subscription.status = 'past_due';
    customerOf(ctx, subscription).delinquent = true;
  });
  return invoice;
}

function openInvoiceOf(ctx: FakeContext, subscription: Subscription): Invoice {
  const invoice = subscription.latest_invoice ? ctx.store.invoices.get(subscription.latest_invoice) : undefined;
  if (!invoice || invoice.status !== 'open') {
    throw new StripeApiError(400, `Subscription ${subscription.id} has no open invoice to pay.`);
  }
  return invoice;
}

/** The customer pays the open invoice (test card succeeds): back to active. */
export function payOpenInvoice(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  const invoice = openInvoiceOf(ctx, subscription);
  collectPaid(ctx, invoice);
  changeSubscription(ctx, subscription, () => {
    subscription.status = 'active';
    customerOf(ctx, subscription).delinquent = false;
  });
  return invoice;
}

/** A declined retry of the open invoice: the subscription stays past_due. */
export function declineOpenInvoice(ctx: FakeContext, subscription: Subscription): Invoice {
  assertNotCanceled(subscription);
  const invoice = openInvoiceOf(ctx, subscription);
  collectFailed(ctx, invoice);
  return invoice;
}

/** A paused subscription does not move to new periods or invoice until it is resumed. */
function assertRenews(subscription: Subscription): void {
  if (subscription.status === 'paused') {
    throw new StripeApiError(400, `Subscription ${subscription.id} is paused: it does not renew until it is resumed.`);
  }
  if (subscription.status === 'incomplete') {
    throw new StripeApiError(400, `Subscription ${subscription.id} is incomplete: its first invoice is not paid.`);
  }
}

/**
 * The current period ends. Cancel-at-period-end → canceled; past_due → canceled (Stripe's
 * default when retries are exhausted); trialing or active → renewed: the period moves on
 * (customer.subscription.updated), then the renewal invoice is created, finalized and paid.
 */
export function advancePeriod(ctx: FakeContext, subscription: Subscription): void {
  assertNotCanceled(subscription);
  assertRenews(subscription);
  const { end } = periodOf(subscription);
  if (subscription.cancel_at_period_end) {
    endSubscription(ctx, subscription, end, 'cancellation_requested', null);
    return;
  }
  if (subscription.status === 'past_due' || subscription.status === 'unpaid') {
    endSubscription(ctx, subscription, end, 'payment_failed', null);
    return;
  }
  const invoice = startNextPeriod(ctx, subscription);
  issue(ctx, subscription, invoice);
  collectPaid(ctx, invoice);
}

/**
 * POST /v1/subscriptions/:id/pause: status `paused` with status_details, no invoices until resumed.
 * Sends customer.subscription.updated (status) and customer.subscription.paused.
 */
export function pauseSubscription(ctx: FakeContext, subscription: Subscription, requestId: string | null): void {
  if (subscription.status !== 'active' && subscription.status !== 'trialing') {
    throw new StripeApiError(400, `Only an active or trialing subscription can be paused; ${subscription.id} is ${subscription.status}.`);
  }
  changeSubscription(ctx, subscription, () => {
    subscription.status = 'paused';
    subscription.status_details = { paused: { subscription: { type: 'pause_requested' }, transitioned_at: nowSeconds(), type: 'subscription' } };
  }, requestId);
  ctx.events.emit('customer.subscription.paused', subscription, undefined, requestId);
}

/**
 * POST /v1/subscriptions/:id/resume. With billing_cycle_anchor `now` (Stripe's default) a new
 * period starts today and its invoice is issued and paid with the test card; with `unchanged` the
 * period stays and nothing is invoiced (prorations are not modelled). Either way the status is
 * active at once: customer.subscription.updated, customer.subscription.resumed, then the
 * invoice's events.
 */
export function resumeSubscription(ctx: FakeContext, subscription: Subscription, anchor: 'now' | 'unchanged', requestId: string | null): void {
  if (subscription.status !== 'paused') {
    throw new StripeApiError(400, `Only a paused subscription can be resumed; ${subscription.id} is ${subscription.status}.`);
  }
  let invoice: Invoice | undefined;
  changeSubscription(ctx, subscription, () => {
    subscription.status = 'active';
    delete subscription.status_details;
    if (anchor === 'now') {
      const now = nowSeconds();
      setPeriod(subscription, now, now + nextPeriodLength(subscription));
      subscription.billing_cycle_anchor = now;
      invoice = draftInvoice(ctx, subscription, 'subscription_update', false);
    }
  }, requestId);
  ctx.events.emit('customer.subscription.resumed', subscription, undefined, requestId);
  if (invoice) {
    issue(ctx, subscription, invoice);
    collectPaid(ctx, invoice);
  }
}
