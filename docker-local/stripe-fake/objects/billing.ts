// Factories for subscriptions, their items and invoices.
import type { Metadata } from '../http/params';
import { newId, nowSeconds } from '../state/ids';
import { planOf } from './catalog';
import type { BillingReason, Customer, Invoice, InvoiceLine, Price, Subscription, SubscriptionItem, SubscriptionStatus } from './types';

export function makeItem(subscriptionId: string, price: Price, quantity: number, start: number, end: number): SubscriptionItem {
  return {
    id: newId('si'),
    object: 'subscription_item',
    billing_thresholds: null,
    created: nowSeconds(),
    current_period_end: end,
    current_period_start: start,
    discounts: [],
    metadata: {},
    plan: planOf(price),
    price: structuredClone(price),
    quantity,
    subscription: subscriptionId,
    tax_rates: [],
  };
}

/** The current billing period, read from the first item (where the API keeps it). */
export function periodOf(subscription: Subscription): { start: number; end: number } {
  const item = subscription.items.data[0];
  return { start: item.current_period_start, end: item.current_period_end };
}

export function makeSubscription(fields: {
  customer: string;
  currency: string;
  start: number;
  periodEnd: number;
  trialEnd: number | null;
  status: SubscriptionStatus;
  metadata: Metadata;
  lines: { price: Price; quantity: number }[];
}): Subscription {
  const id = newId('sub');
  return {
    id,
    object: 'subscription',
    application: null,
    billing_cycle_anchor: fields.periodEnd,
    cancel_at: null,
    cancel_at_period_end: false,
    canceled_at: null,
    cancellation_details: { comment: null, feedback: null, reason: null },
    collection_method: 'charge_automatically',
    created: fields.start,
    currency: fields.currency,
    customer: fields.customer,
    days_until_due: null,
    default_payment_method: null,
    description: null,
    discounts: [],
    ended_at: null,
    items: {
      object: 'list',
      data: fields.lines.map((l) => makeItem(id, l.price, l.quantity, fields.start, fields.periodEnd)),
      has_more: false,
      total_count: fields.lines.length,
      url: `/v1/subscription_items?subscription=${id}`,
    },
    latest_invoice: null,
    livemode: false,
    metadata: fields.metadata,
    pause_collection: null,
    pending_update: null,
    schedule: null,
    start_date: fields.start,
    status: fields.status,
    test_clock: null,
    trial_end: fields.trialEnd,
    trial_start: fields.trialEnd ? fields.start : null,
  };
}

/**
 * A draft invoice for the subscription's current period, priced from its items. Drafts have no
 * number and are not yet due; `finalize` makes them open.
 */
export function makeInvoice(customer: Customer, subscription: Subscription, reason: BillingReason, free: boolean): Invoice {
  const id = newId('in');
  const now = nowSeconds();
  const { start, end } = periodOf(subscription);
  const lines: InvoiceLine[] = subscription.items.data.map((item) => ({
    id: newId('il'),
    object: 'line_item',
    amount: free ? 0 : item.price.unit_amount * item.quantity,
    currency: item.price.currency,
    description: `${item.quantity} × ${item.price.nickname ?? item.price.product}`,
    invoice: id,
    livemode: false,
    metadata: {},
    parent: {
      type: 'subscription_item_details',
      subscription_item_details: {
        subscription: subscription.id,
        subscription_item: item.id,
        proration: false,
        invoice_item: null,
        proration_details: null,
      },
      invoice_item_details: null,
    },
    period: { start, end },
    pricing: {
      type: 'price_details',
      price_details: { price: item.price.id, product: item.price.product },
      unit_amount_decimal: item.price.unit_amount_decimal,
    },
    quantity: item.quantity,
    subscription: subscription.id,
  }));
  const total = lines.reduce((sum, line) => sum + line.amount, 0);
  return {
    id,
    object: 'invoice',
    account_country: 'XX',
    account_name: 'Local payments fake',
    amount_due: total,
    amount_paid: 0,
    amount_remaining: total,
    attempt_count: 0,
    attempted: false,
    auto_advance: true,
    billing_reason: reason,
    collection_method: 'charge_automatically',
    created: now,
    currency: subscription.currency,
    customer: customer.id,
    customer_email: customer.email,
    customer_name: customer.name,
    description: null,
    due_date: null,
    effective_at: null,
    hosted_invoice_url: null,
    invoice_pdf: null,
    lines: { object: 'list', data: lines, has_more: false, total_count: lines.length, url: `/v1/invoices/${id}/lines` },
    livemode: false,
    metadata: {},
    next_payment_attempt: null,
    number: null,
    parent: {
      type: 'subscription_details',
      quote_details: null,
      subscription_details: { metadata: structuredClone(subscription.metadata), subscription: subscription.id },
    },
    period_end: end,
    period_start: start,
    status: 'draft',
    status_transitions: { finalized_at: null, marked_uncollectible_at: null, paid_at: null, voided_at: null },
    subtotal: total,
    total,
    webhooks_delivered_at: null,
  };
}

/** Draft → open: numbered from the customer's sequence, as Stripe numbers at finalization. */
export function finalize(invoice: Invoice, customer: Customer): void {
  const now = nowSeconds();
  invoice.number = `${customer.invoice_prefix}-${String(customer.next_invoice_sequence).padStart(4, '0')}`;
  customer.next_invoice_sequence += 1;
  invoice.status = 'open';
  invoice.effective_at = now;
  invoice.status_transitions.finalized_at = now;
}

export function markPaid(invoice: Invoice): void {
  invoice.attempted = true;
  invoice.attempt_count += 1;
  invoice.amount_paid = invoice.amount_due;
  invoice.amount_remaining = 0;
  invoice.status = 'paid';
  invoice.next_payment_attempt = null;
  invoice.status_transitions.paid_at = nowSeconds();
}

/** Stripe's default smart-retry schedule puts the next attempt a few days out. */
export function markFailed(invoice: Invoice): void {
  invoice.attempted = true;
  invoice.attempt_count += 1;
  invoice.status = 'open';
  invoice.next_payment_attempt = nowSeconds() + 3 * 86_400;
}
