// Wire shapes the fake returns: the subset of Stripe API fields (API version of stripe-node 23)
// that a subscription integration reads. Field names and nesting follow the SDK's .d.ts files.
import type { Metadata } from '../http/params';

export interface Customer {
  id: string;
  object: 'customer';
  address: null;
  balance: number;
  created: number;
  currency: string | null;
  default_source: null;
  delinquent: boolean;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  invoice_settings: { custom_fields: null; default_payment_method: string | null; footer: null; rendering_options: null };
  livemode: false;
  metadata: Metadata;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
  preferred_locales: string[];
  shipping: null;
  tax_exempt: 'none';
  test_clock: null;
}

export interface Product {
  id: string;
  object: 'product';
  active: boolean;
  created: number;
  default_price: string | null;
  description: string | null;
  images: string[];
  livemode: false;
  marketing_features: { name: string }[];
  metadata: Metadata;
  name: string;
  package_dimensions: null;
  shippable: null;
  statement_descriptor: string | null;
  tax_code: null;
  type: 'service';
  unit_label: string | null;
  updated: number;
  url: string | null;
}

export type Interval = 'day' | 'week' | 'month' | 'year';

export interface Recurring {
  interval: Interval;
  interval_count: number;
  meter: null;
  trial_period_days: null;
  usage_type: 'licensed';
}

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  custom_unit_amount: null;
  livemode: false;
  lookup_key: string | null;
  metadata: Metadata;
  nickname: string | null;
  product: string;
  recurring: Recurring | null;
  tax_behavior: 'unspecified';
  tiers_mode: null;
  transform_quantity: null;
  type: 'recurring' | 'one_time';
  unit_amount: number;
  /** A decimal string on the wire; the SDK turns it into its Decimal type. */
  unit_amount_decimal: string;
}

/**
 * The legacy Plan view of an item's price. The stripe-node 23 types (API 2026-10-28) still list
 * it as a field every subscription item returns, so the fake keeps it; the app reads `price`.
 */
export interface Plan {
  id: string;
  object: 'plan';
  active: boolean;
  amount: number;
  amount_decimal: string;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  interval: Interval;
  interval_count: number;
  livemode: false;
  metadata: Metadata;
  meter: null;
  nickname: string | null;
  product: string;
  tiers_mode: null;
  transform_usage: null;
  trial_period_days: null;
  usage_type: 'licensed';
}

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  total_count?: number;
  url: string;
}

export interface SubscriptionItem {
  id: string;
  object: 'subscription_item';
  billing_thresholds: null;
  created: number;
  current_period_end: number;
  current_period_start: number;
  discounts: string[];
  metadata: Metadata;
  plan: Plan;
  price: Price;
  quantity: number;
  subscription: string;
  tax_rates: [];
}

export type SubscriptionStatus =
  | 'incomplete'
  | 'incomplete_expired'
  | 'trialing'
  | 'active'
  | 'past_due'
  | 'canceled'
  | 'unpaid'
  | 'paused';

/**
 * Since API version 2025-03-31 the billing period is on each item only (`items.data[].
 * current_period_start/end`); the subscription itself no longer carries it, so neither does this.
 */
export interface Subscription {
  id: string;
  object: 'subscription';
  application: null;
  billing_cycle_anchor: number;
  cancel_at: number | null;
  cancel_at_period_end: boolean;
  canceled_at: number | null;
  cancellation_details: { comment: string | null; feedback: string | null; reason: string | null };
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  customer: string;
  days_until_due: null;
  default_payment_method: string | null;
  description: string | null;
  discounts: string[];
  ended_at: number | null;
  items: ListObject<SubscriptionItem>;
  latest_invoice: string | null;
  livemode: false;
  metadata: Metadata;
  pause_collection: null;
  pending_update: null;
  schedule: null;
  start_date: number;
  status: SubscriptionStatus;
  /** Present while paused: why and since when (Stripe adds it with the pause endpoint). */
  status_details?: { paused: { subscription: { type: 'pause_requested' }; transitioned_at: number; type: 'subscription' } };
  test_clock: null;
  trial_end: number | null;
  trial_start: number | null;
}

export interface InvoiceLine {
  id: string;
  object: 'line_item';
  amount: number;
  currency: string;
  description: string;
  invoice: string;
  livemode: false;
  metadata: Metadata;
  parent: {
    type: 'subscription_item_details';
    subscription_item_details: { subscription: string; subscription_item: string; proration: false; invoice_item: null; proration_details: null };
    invoice_item_details: null;
  };
  period: { start: number; end: number };
  pricing: { type: 'price_details'; price_details: { price: string; product: string }; unit_amount_decimal: string };
  quantity: number;
  subscription: string;
}

export type InvoiceStatus = 'draft' | 'open' | 'paid' | 'uncollectible' | 'void';
export type BillingReason = 'subscription_create' | 'subscription_cycle' | 'subscription_update' | 'manual';

export interface Invoice {
  id: string;
  object: 'invoice';
  account_country: string;
  account_name: string;
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  auto_advance: boolean;
  billing_reason: BillingReason;
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  customer: string;
  customer_email: string | null;
  customer_name: string | null;
  description: string | null;
  due_date: null;
  effective_at: number | null;
  hosted_invoice_url: string | null;
  invoice_pdf: null;
  lines: ListObject<InvoiceLine>;
  livemode: false;
  metadata: Metadata;
  next_payment_attempt: number | null;
  /** Assigned when the invoice is finalized; a draft has none. */
  number: string | null;
  parent: {
    type: 'subscription_details';
    quote_details: null;
    subscription_details: { metadata: Metadata; subscription: string };
  };
  period_end: number;
  period_start: number;
  status: InvoiceStatus;
  status_transitions: { finalized_at: number | null; marked_uncollectible_at: null; paid_at: number | null; voided_at: null };
  subtotal: number;
  total: number;
  webhooks_delivered_at: number | null;
}

export interface CheckoutLineItem {
  id: string;
  object: 'item';
  amount_discount: 0;
  amount_subtotal: number;
  amount_tax: 0;
  amount_total: number;
  currency: string;
  description: string;
  price: Price;
  quantity: number;
}

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  allow_promotion_codes: boolean | null;
  amount_subtotal: number;
  amount_total: number;
  billing_address_collection: null;
  cancel_url: string | null;
  client_reference_id: string | null;
  client_secret: null;
  created: number;
  currency: string;
  customer: string | null;
  customer_creation: 'always' | null;
  customer_details: { email: string | null; name: string | null; phone: null; address: null; tax_exempt: 'none'; tax_ids: [] } | null;
  customer_email: string | null;
  expires_at: number;
  invoice: string | null;
  livemode: false;
  locale: string | null;
  metadata: Metadata;
  mode: 'subscription';
  payment_intent: null;
  payment_link: null;
  payment_method_collection: 'always';
  payment_method_types: string[];
  payment_status: 'paid' | 'unpaid' | 'no_payment_required';
  status: 'open' | 'complete' | 'expired';
  subscription: string | null;
  success_url: string;
  total_details: { amount_discount: 0; amount_shipping: 0; amount_tax: 0 };
  ui_mode: 'hosted';
  url: string | null;
}

export interface PortalSession {
  id: string;
  object: 'billing_portal.session';
  configuration: string;
  created: number;
  customer: string;
  flow: null;
  livemode: false;
  locale: string | null;
  on_behalf_of: null;
  return_url: string | null;
  url: string;
}

export interface StripeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: object; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}
