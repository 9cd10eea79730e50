import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { POST } from '@/app/api/webhooks/stripe/route';
import {
  companyPlanId,
  createBillingCompany,
  createTestPlan,
  eventOf,
  planIdByCode,
  rand,
  subscriptionObject,
  subscriptionRow,
  webhookEventRow,
  webhookRequest,
  type TestPlan,
} from './billing-fixtures';

/**
 * The webhook route handler against the real MariaDB: signature checks (Stripe's scheme,
 * verified by the official SDK), allow-listed types, each event id applied once, and subscription
 * events that arrive out of order ending in the state of the newest one.
 */
let crew: TestPlan;
let fleet: TestPlan;
let benchId: number;

beforeAll(async () => {
  crew = await createTestPlan({ seats: 5 });
  fleet = await createTestPlan({ seats: 25 });
  benchId = await planIdByCode('bench');
});

afterAll(async () => {
  await closeSequelize();
});

async function deliver(event: object, opts?: Parameters<typeof webhookRequest>[1]) {
  const res = await POST(webhookRequest(event, opts));
  return { status: res.status, body: (await res.json()) as { outcome?: string; error?: { code: string } } };
}

const now = () => Math.floor(Date.now() / 1000);

describe('webhook signature', () => {
  it('rejects a payload signed with another secret (forged) with 400 and stores nothing', async () => {
    const company = await createBillingCompany();
    const event = eventOf('customer.subscription.created', subscriptionObject({ id: `sub_${rand()}`, customer: company.customerId!, status: 'active', plan: crew }), now());
    const res = await deliver(event, { secret: 'whsec_not_our_secret_at_all' });
    expect(res.status).toBe(400);
    expect(res.body.error?.code).toBe('invalid_signature');
    expect(await webhookEventRow(event.id)).toBeNull();
    expect(await companyPlanId(company.id)).toBe(benchId);
  });

  it('rejects a correctly signed but stale request (signed 6 minutes ago, tolerance 5) with 400', async () => {
    const company = await createBillingCompany();
    const event = eventOf('customer.subscription.created', subscriptionObject({ id: `sub_${rand()}`, customer: company.customerId!, status: 'active', plan: crew }), now());
    const res = await deliver(event, { timestamp: now() - 360 });
    expect(res.status).toBe(400);
    expect(await webhookEventRow(event.id)).toBeNull();
  });

  it('rejects a missing header, and a body altered after signing', async () => {
    const event = eventOf('invoice.paid', { id: `in_${rand()}`, object: 'invoice' }, now());
    expect((await deliver(event, { header: null })).status).toBe(400);
    const signed = webhookRequest(event);
    const tampered = new Request(signed.url, { method: 'POST', headers: signed.headers, body: JSON.stringify({ ...event, type: 'customer.subscription.deleted' }) });
    expect((await POST(tampered)).status).toBe(400);
  });

  it('acknowledges a correctly signed event of a type not on the allow-list without storing it', async () => {
    const event = eventOf('charge.refunded', { id: `ch_${rand()}`, object: 'charge' }, now());
    const res = await deliver(event);
    expect(res.status).toBe(200);
    expect(await webhookEventRow(event.id)).toBeNull();
  });
});

describe('each event id is applied once', () => {
  it('the same event delivered three times in a row has one effect', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const event = eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), now());
    const outcomes = [];
    for (let i = 0; i < 3; i++) outcomes.push((await deliver(event)).body.outcome);
    expect(outcomes).toEqual(['applied', 'duplicate', 'duplicate']);
    const stored = await webhookEventRow(event.id);
    expect(stored?.deliveryCount).toBe(3);
    expect(stored?.processedAt).toBeInstanceOf(Date);
    expect(await companyPlanId(company.id)).toBe(crew.id);
  });

  it('three parallel deliveries of one payment failure start one grace period and record one receipt', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const t0 = now() - 100;
    await deliver(eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), t0));
    const pastDue = eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status: 'past_due', plan: crew }), t0 + 50);
    const results = await Promise.all([deliver(pastDue), deliver(pastDue), deliver(pastDue)]);
    expect(results.map((r) => r.status)).toEqual([200, 200, 200]);
    expect(results.map((r) => r.body.outcome).sort()).toEqual(['applied', 'duplicate', 'duplicate']);
    const row = await subscriptionRow(subId);
    expect(row?.status).toBe('past_due');
    expect(row?.pastDueSince?.getTime()).toBe((t0 + 50) * 1000);
    expect((await webhookEventRow(pastDue.id))?.deliveryCount).toBe(3);
  });

  it('a redelivered old event does not undo a newer one (same id, applied once, then stale by order)', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const t0 = now() - 200;
    const created = eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), t0);
    const upgraded = eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: fleet }), t0 + 10);
    await deliver(created);
    await deliver(upgraded);
    expect((await deliver(created)).body.outcome).toBe('duplicate');
    expect(await companyPlanId(company.id)).toBe(fleet.id);
  });
});

describe('out-of-order subscription events', () => {
  it('deleted, then created, then updated (sent in that order) ends canceled on the free tier', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const c = company.customerId!;
    const t0 = now() - 300;
    const created = eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: c, status: 'active', plan: crew }), t0);
    const updated = eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: c, status: 'active', plan: fleet }), t0 + 30);
    const deleted = eventOf('customer.subscription.deleted', subscriptionObject({ id: subId, customer: c, status: 'canceled', plan: fleet }), t0 + 60);
    expect((await deliver(deleted)).body.outcome).toBe('applied');
    expect((await deliver(created)).body.outcome).toBe('stale');
    expect((await deliver(updated)).body.outcome).toBe('stale');
    const row = await subscriptionRow(subId);
    expect(row?.status).toBe('canceled');
    expect(row?.planId).toBe(fleet.id);
    expect(await companyPlanId(company.id)).toBe(benchId);
  });

  it('an upgrade that arrives before the creation keeps the upgraded plan', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const t0 = now() - 300;
    await deliver(eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: fleet }), t0 + 20));
    await deliver(eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), t0));
    expect((await subscriptionRow(subId))?.planId).toBe(fleet.id);
    expect(await companyPlanId(company.id)).toBe(fleet.id);
  });

  it('"paid again" before "past due" leaves the subscription active with no grace period running', async () => {
    const company = await createBillingCompany();
    const subId = `sub_${rand()}`;
    const t0 = now() - 300;
    await deliver(eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), t0));
    await deliver(eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status: 'active', plan: crew }), t0 + 40));
    expect((await deliver(eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status: 'past_due', plan: crew }), t0 + 20))).body.outcome).toBe('stale');
    const row = await subscriptionRow(subId);
    expect(row?.status).toBe('active');
    expect(row?.pastDueSince).toBeNull();
    expect(row?.graceEndsAt).toBeNull();
  });

  it('finds the company through the metadata when the customer id is not stored yet, and adopts it', async () => {
    const company = await createBillingCompany({ customerId: null });
    const subId = `sub_${rand()}`;
    const customer = `cus_test_${rand()}`;
    const res = await deliver(eventOf('customer.subscription.created', subscriptionObject({ id: subId, customer, status: 'active', plan: crew, metadata: { fadeledger_company_id: String(company.id) } }), now()));
    expect(res.body.outcome).toBe('applied');
    expect(await companyPlanId(company.id)).toBe(crew.id);
    const { models } = await import('@/db/models');
    const [[row]] = (await models().sequelize.query('SELECT stripe_customer_id AS c FROM companies WHERE id = ?', { replacements: [company.id] })) as [{ c: string }[], unknown];
    expect(row.c).toBe(customer);
  });

  it('an event for a customer we do not know is acknowledged and recorded as unmatched', async () => {
    const event = eventOf('customer.subscription.created', subscriptionObject({ id: `sub_${rand()}`, customer: `cus_test_${rand()}`, status: 'active', plan: crew }), now());
    const res = await deliver(event);
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('unmatched_company');
    expect((await webhookEventRow(event.id))?.outcome).toBe('unmatched_company');
  });
});
