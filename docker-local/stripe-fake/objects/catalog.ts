// Factories for customers, products and prices, filled with Stripe's defaults for unset fields.
import type { Metadata } from '../http/params';
import { newId, nowSeconds, randomToken } from '../state/ids';
import type { Customer, Interval, Plan, Price, Product } from './types';

export function makeCustomer(fields: {
  email: string | null;
  name: string | null;
  description: string | null;
  phone: string | null;
  metadata: Metadata;
}): Customer {
  return {
    id: newId('cus'),
    object: 'customer',
    address: null,
    balance: 0,
    created: nowSeconds(),
    currency: null,
    default_source: null,
    delinquent: false,
    description: fields.description,
    email: fields.email,
    invoice_prefix: randomToken(8).toUpperCase(),
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: fields.metadata,
    name: fields.name,
    next_invoice_sequence: 1,
    phone: fields.phone,
    preferred_locales: [],
    shipping: null,
    tax_exempt: 'none',
    test_clock: null,
  };
}

export function makeProduct(fields: {
  id?: string;
  name: string;
  description: string | null;
  active: boolean;
  metadata: Metadata;
  statementDescriptor: string | null;
  unitLabel: string | null;
  url: string | null;
  marketingFeatures: { name: string }[];
}): Product {
  const now = nowSeconds();
  return {
    id: fields.id ?? newId('prod'),
    object: 'product',
    active: fields.active,
    created: now,
    default_price: null,
    description: fields.description,
    images: [],
    livemode: false,
    marketing_features: fields.marketingFeatures,
    metadata: fields.metadata,
    name: fields.name,
    package_dimensions: null,
    shippable: null,
    statement_descriptor: fields.statementDescriptor,
    tax_code: null,
    type: 'service',
    unit_label: fields.unitLabel,
    updated: now,
    url: fields.url,
  };
}

export function makePrice(fields: {
  product: string;
  currency: string;
  unitAmount: number;
  recurring: { interval: Interval; intervalCount: number } | null;
  active: boolean;
  nickname: string | null;
  lookupKey: string | null;
  metadata: Metadata;
}): Price {
  return {
    id: newId('price'),
    object: 'price',
    active: fields.active,
    billing_scheme: 'per_unit',
    created: nowSeconds(),
    currency: fields.currency,
    custom_unit_amount: null,
    livemode: false,
    lookup_key: fields.lookupKey,
    metadata: fields.metadata,
    nickname: fields.nickname,
    product: fields.product,
    recurring: fields.recurring
      ? {
          interval: fields.recurring.interval,
          interval_count: fields.recurring.intervalCount,
          meter: null,
          trial_period_days: null,
          usage_type: 'licensed',
        }
      : null,
    tax_behavior: 'unspecified',
    tiers_mode: null,
    transform_quantity: null,
    type: fields.recurring ? 'recurring' : 'one_time',
    unit_amount: fields.unitAmount,
    unit_amount_decimal: String(fields.unitAmount),
  };
}

/** Subscription items still carry the legacy Plan view of their recurring price. */
export function planOf(price: Price): Plan {
  const recurring = price.recurring ?? { interval: 'month' as Interval, interval_count: 1 };
  return {
    id: price.id,
    object: 'plan',
    active: price.active,
    amount: price.unit_amount,
    amount_decimal: price.unit_amount_decimal,
    billing_scheme: 'per_unit',
    created: price.created,
    currency: price.currency,
    interval: recurring.interval,
    interval_count: recurring.interval_count,
    livemode: false,
    metadata: price.metadata,
    meter: null,
    nickname: price.nickname,
    product: price.product,
    tiers_mode: null,
    transform_usage: null,
    trial_period_days: null,
    usage_type: 'licensed',
  };
}

const DAYS_PER_INTERVAL: Record<Interval, number> = { day: 1, week: 7, month: 30, year: 365 };

/**
 * Length of one billing period in seconds. A month is a flat 30 days here (Stripe uses calendar
 * months); tests and the app only rely on the period end being in the future and moving on.
 */
export function periodSeconds(price: Price): number {
  const recurring = price.recurring ?? { interval: 'month' as Interval, interval_count: 1 };
  return DAYS_PER_INTERVAL[recurring.interval] * recurring.interval_count * 86_400;
}
