import { describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { reshapeInvoice, reshapeSubscription } from '@/server/billing/provider-objects';
import { priceToCents } from '@/server/billing/plan-sync';
import { stripeConfigFromEnv } from '@/server/billing/stripe';
import { kindAndPriceProblems, newPlanSchema } from '@/server/billing/plan-schema';

/**
 * Where provider data comes in (pure, no services needed): the current API version's shapes (and,
 * for invoices, the older one a Stripe account may still be pinned to); and the client is
 * configured from the environment only (unset host = Stripe itself).
 */
const sub = (over: Record<string, unknown>) => ({ id: 'sub_1', customer: 'cus_1', status: 'active', cancel_at_period_end: false, cancel_at: null, canceled_at: null, ended_at: null, metadata: {}, items: { data: [] }, ...over }) as unknown as Stripe.Subscription;

describe('provider objects', () => {
  it('reads the period end from the item, never from the subscription (gone since API 2025-03-31)', () => {
    const current = reshapeSubscription(sub({ items: { data: [{ current_period_end: 1_900_000_000, price: { id: 'price_a', product: 'prod_a' } }] } }));
    expect(current).toMatchObject({ priceId: 'price_a', productId: 'prod_a', currentPeriodEnd: new Date(1_900_000_000_000) });
    // A payload that still carries the retired field next to the item's: the item's value wins.
    const both = reshapeSubscription(sub({ current_period_end: 1_800_000_000, items: { data: [{ current_period_end: 1_900_000_000, price: { id: 'price_a', product: 'prod_a' } }] } }));
    expect(both.currentPeriodEnd).toEqual(new Date(1_900_000_000_000));
    // Only the retired field: no period rather than a value the pinned API version does not send.
    const legacy = reshapeSubscription(sub({ current_period_end: 1_800_000_000, items: { data: [{ price: { id: 'price_b', product: { id: 'prod_b' } } }] } }));
    expect(legacy).toMatchObject({ productId: 'prod_b', currentPeriodEnd: null });
  });

  it('treats a cancel_at date like cancel at period end (newer portals set the date)', () => {
    expect(reshapeSubscription(sub({ cancel_at: 1_900_000_000 })).cancelAtPeriodEnd).toBe(true);
    expect(reshapeSubscription(sub({ cancel_at_period_end: true })).cancelAtPeriodEnd).toBe(true);
    expect(reshapeSubscription(sub({ status: 'canceled', cancel_at: 1_900_000_000 })).cancelAtPeriodEnd).toBe(false);
  });

  it('refuses a status it does not know rather than guessing', () => {
    expect(() => reshapeSubscription(sub({ status: 'on_fire' }))).toThrow(/Unknown subscription status/);
  });

  it('finds the invoice\'s subscription under parent (current API) or at the top (older API)', () => {
    expect(reshapeInvoice({ id: 'in_1', customer: 'cus_1', status: 'open', parent: { subscription_details: { subscription: 'sub_9' } } } as unknown as Stripe.Invoice).subscriptionId).toBe('sub_9');
    expect(reshapeInvoice({ id: 'in_2', customer: 'cus_1', status: 'paid', subscription: 'sub_8' } as unknown as Stripe.Invoice).subscriptionId).toBe('sub_8');
  });
});

describe('prices and plan fields', () => {
  it('turns decimal price strings into whole cents exactly', () => {
    expect(priceToCents('49.00')).toBe(4900);
    expect(priceToCents('0.10')).toBe(10);
    expect(priceToCents('149.99')).toBe(14999);
    expect(() => priceToCents('1.005')).toThrow(/whole number of cents/);
  });

  it('paid plans cost something, free and trial plans nothing; trial days only on trials', () => {
    expect(kindAndPriceProblems('paid', '0.00', null)).toHaveProperty('monthlyPriceUsd');
    expect(kindAndPriceProblems('free', '0.00', null)).toEqual({});
    expect(kindAndPriceProblems('trial', '0.00', null)).toHaveProperty('trialDays');
    expect(kindAndPriceProblems('paid', '9.00', 14)).toHaveProperty('trialDays');
    expect(newPlanSchema.safeParse({ code: 'Bad Code', kind: 'paid', name: 'X', monthlyPriceUsd: '5', seatLimit: 1, studiesPerMonth: 1, activeLinksLimit: 1, uploadsPerMonth: 1, sortOrder: 1 }).success).toBe(false);
  });
});

describe('provider client configuration', () => {
  it('talks to Stripe itself unless host, port and protocol are set', () => {
    const real = stripeConfigFromEnv({ STRIPE_API_HOST: undefined, STRIPE_API_PORT: undefined, STRIPE_API_PROTOCOL: undefined });
    expect(real).not.toHaveProperty('host');
    expect(real).not.toHaveProperty('port');
    expect(real).not.toHaveProperty('protocol');
    expect(stripeConfigFromEnv({ STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PORT: 12111, STRIPE_API_PROTOCOL: 'http' })).toMatchObject({ host: '127.0.0.1', port: 12111, protocol: 'http' });
  });
});
