import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';
import { expect } from 'vitest';
import { models } from '@/db/models';
import { POST as webhook } from '@/app/api/webhooks/stripe/route';
import type { BillingActor } from '@/server/billing/checkout';
import { getStripe } from '@/server/billing/stripe';
import { createUserWithRole } from './support/factories';

/**
 * Billing fixtures for integration tests: plans with provider ids of their own (so a test never
 * touches the seeded catalogue's ids), companies with a provider customer id, Stripe-shaped
 * events signed exactly as the provider signs them (the SDK's own test header), and the round
 * trip through the test services' payments fake: its events about some objects, delivered to our
 * webhook route, and its /_fake test hooks.
 */
export const rand = () => randomBytes(5).toString('hex');

export type TestPlan = { id: number; code: string; productId: string; priceId: string };

export async function createTestPlan(opts: { seats?: number; studies?: number; links?: number; uploads?: number; apiAccess?: boolean; kind?: 'paid' | 'free' | 'trial'; price?: string } = {}): Promise<TestPlan> {
  const { Plan } = models();
  const code = `bt-${rand()}`;
  const productId = `prod_test_${rand()}`;
  const priceId = `price_test_${rand()}`;
  const plan = await Plan.create({
    code,
    name: `Test plan ${code}`,
    description: null,
    monthlyPriceUsd: opts.price ?? '29.00',
    seatLimit: opts.seats ?? 5,
    studiesPerMonth: opts.studies ?? 50,
    activeLinksLimit: opts.links ?? 10,
    uploadsPerMonth: opts.uploads ?? 5,
    apiAccess: opts.apiAccess ?? false,
    quoteBranding: true,
    kind: opts.kind ?? 'paid',
    trialDays: null,
    isPublic: false,
    sortOrder: 90,
    stripeProductId: productId,
    stripePriceId: priceId,
  });
  return { id: plan.id, code, productId, priceId };
}

export async function planIdByCode(code: string): Promise<number> {
  const { Plan } = models();
  const plan = await Plan.findOne({ where: { code } });
  if (!plan) throw new Error(`plan ${code} missing: run the migrations`);
  return plan.id;
}

export async function createBillingCompany(opts: { planCode?: string; planId?: number; trialEndsAt?: Date | null; customerId?: string | null } = {}): Promise<{ id: number; customerId: string | null }> {
  const { Company, sequelize } = models();
  const planId = opts.planId ?? (await planIdByCode(opts.planCode ?? 'bench'));
  const company = await Company.create({ name: `Billing Test Aerials ${rand()}`, planId, trialEndsAt: opts.trialEndsAt ?? null });
  const customerId = opts.customerId === undefined ? `cus_test_${rand()}` : opts.customerId;
  if (customerId) await sequelize.query('UPDATE companies SET stripe_customer_id = ? WHERE id = ?', { replacements: [customerId, company.id] });
  return { id: company.id, customerId };
}

export async function companyPlanId(companyId: number): Promise<number> {
  const { Company } = models();
  return (await Company.findByPk(companyId, { rejectOnEmpty: true })).planId;
}

/** A subscription object as the provider sends it (only the fields billing reads, plus ids). */
export function subscriptionObject(o: { id: string; customer: string; status: string; plan: TestPlan; periodEnd?: number; cancelAtPeriodEnd?: boolean; metadata?: Record<string, string> }) {
  const periodEnd = o.periodEnd ?? Math.floor(Date.now() / 1000) + 30 * 86_400;
  return {
    id: o.id,
    object: 'subscription',
    customer: o.customer,
    status: o.status,
    cancel_at_period_end: o.cancelAtPeriodEnd ?? false,
    cancel_at: o.cancelAtPeriodEnd ? periodEnd : null,
    canceled_at: o.status === 'canceled' ? periodEnd - 100 : null,
    ended_at: o.status === 'canceled' ? periodEnd - 100 : null,
    metadata: o.metadata ?? {},
    items: {
      object: 'list',
      data: [{ id: `si_${rand()}`, object: 'subscription_item', current_period_end: periodEnd, current_period_start: periodEnd - 30 * 86_400, price: { id: o.plan.priceId, object: 'price', product: o.plan.productId } }],
    },
  };
}

export function eventOf(type: string, object: object, created: number, id = `evt_test_${rand()}`) {
  return { id, object: 'event', api_version: '2026-10-28.endive', created, type, livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, data: { object } };
}

const signer = new Stripe('sk_test_signing_only');

/** A POST to the webhook route, signed with `secret` at `timestamp` (defaults: our secret, now). */
export function webhookRequest(event: object, opts: { secret?: string; timestamp?: number; header?: string | null } = {}): Request {
  const payload = JSON.stringify(event);
  const header =
    opts.header !== undefined
      ? opts.header
      : signer.webhooks.generateTestHeaderString({ payload, secret: opts.secret ?? (process.env.STRIPE_WEBHOOK_SECRET as string), timestamp: opts.timestamp ?? Math.floor(Date.now() / 1000) });
  const headers: Record<string, string> = { 'content-type': 'application/json' };
  if (header !== null) headers['stripe-signature'] = header;
  return new Request(`${process.env.APP_URL ?? 'http://localhost:3100'}/api/webhooks/stripe`, { method: 'POST', headers, body: payload });
}

export async function subscriptionRow(providerSubscriptionId: string) {
  const { Subscription } = models();
  return Subscription.findOne({ where: { providerSubscriptionId } });
}

export async function webhookEventRow(providerEventId: string) {
  const { WebhookEvent } = models();
  return WebhookEvent.findOne({ where: { providerEventId } });
}

// ---- through the payments fake the test services run ------------------------------------------

/** Paid plans a test made, public so the checkout offers them; `hideMadePlans` in afterAll. */
const madePlans: number[] = [];

/** A public paid plan with no provider ids yet: the first checkout syncs it to the provider. */
export async function newPaidPlan(price: string, seats = 3) {
  const { Plan } = models();
  const code = `bc-${rand()}`;
  const plan = await Plan.create({
    code, name: `Checkout test ${code}`, description: 'Invented plan for a billing test.', monthlyPriceUsd: price, seatLimit: seats, studiesPerMonth: 40,
    activeLinksLimit: 8, uploadsPerMonth: 4, apiAccess: false, quoteBranding: true, kind: 'paid', trialDays: null, isPublic: true, sortOrder: 95,
    stripeProductId: null, stripePriceId: null,
  });
  madePlans.push(plan.id);
  return plan;
}

/** Keeps the shared test database's plan picker clean for the browser tests. */
export async function hideMadePlans(): Promise<void> {
  if (madePlans.length) await models().Plan.update({ isPublic: false }, { where: { id: madePlans } });
}

export async function actorFor(companyId: number): Promise<BillingActor> {
  const admin = await createUserWithRole(companyId, 'admin');
  return { companyId, userId: admin.id, email: admin.email };
}

export const fakeBase = () => `${process.env.STRIPE_API_PROTOCOL ?? 'http'}://${process.env.STRIPE_API_HOST}:${process.env.STRIPE_API_PORT}`;

/** POSTs a /_fake test hook (never part of the Stripe API) and expects it to succeed. */
export async function fakeHook(path: string) {
  const res = await fetch(`${fakeBase()}${path}`, { method: 'POST' });
  expect(res.status, `${path} → ${res.status}`).toBe(200);
}

/** Pays a checkout on the provider's hosted test page, as the browser would. */
export async function payOnHostedPage(checkoutUrl: string): Promise<Response> {
  return fetch(`${checkoutUrl}/pay`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: '' });
}

/** Events the provider sent about these objects, oldest first (the API lists newest first). */
export async function eventsAbout(ids: string[], types?: string[]): Promise<Stripe.Event[]> {
  const all: Stripe.Event[] = [];
  for await (const e of getStripe().events.list({ limit: 100 })) {
    const obj = e.data.object as { id?: string; customer?: string; subscription?: string; parent?: { subscription_details?: { subscription?: string } } };
    const related = [obj.id, obj.customer, obj.subscription, obj.parent?.subscription_details?.subscription].some((v) => v && ids.includes(v));
    if (related && (!types || types.includes(e.type))) all.push(e);
    if (all.length > 200) break;
  }
  return all.reverse();
}

/** Delivers an event to our webhook route, signed; its HTTP status and our outcome. */
export async function deliver(event: object) {
  const res = await webhook(webhookRequest(event));
  return { status: res.status, outcome: ((await res.json()) as { outcome?: string }).outcome };
}
