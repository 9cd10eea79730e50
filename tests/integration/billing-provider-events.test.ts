import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { startCheckout } from '@/server/billing/checkout';
import { getPlanLimits } from '@/server/billing/limits';
import { getStripe } from '@/server/billing/stripe';
import {
  actorFor,
  companyPlanId,
  createBillingCompany,
  deliver,
  eventsAbout,
  fakeBase,
  fakeHook,
  hideMadePlans,
  newPaidPlan,
  payOnHostedPage,
  planIdByCode,
  subscriptionRow,
  webhookEventRow,
} from './billing-fixtures';

/**
 * Our webhook handling fed the event sequences the payments service really sends (the test
 * services' Stripe-compatible fake, driven through the official SDK): a new subscription that
 * waits on its first payment (incomplete) before it is active, a renewal with its invoice events,
 * and a pause and resume. Each test delivers the provider's own events to our route, in the
 * provider's order or a chosen one, and checks what the company may do at each step.
 *
 * No app may be listening where the fake delivers its events while these run (under `npm test`
 * the app starts after vitest): it would apply the same events first and ours would be
 * duplicates. beforeAll says so at once rather than letting the steps fail one by one.
 */
beforeAll(async () => {
  const health = (await (await fetch(`${fakeBase()}/_fake/health`)).json()) as { webhook_url: string | null };
  if (!health.webhook_url) return;
  const answered = await fetch(health.webhook_url, { method: 'GET' }).then(() => true, () => false);
  if (answered) {
    throw new Error(`An app answers at ${health.webhook_url}, where the payments fake delivers its events; it would apply them before these tests do. Stop it (or run under npm test) and run again.`);
  }
});

afterAll(async () => {
  await hideMadePlans();
  await closeSequelize();
});

const toDate = (unix: number) => new Date(unix * 1000);
const typesOf = (events: Stripe.Event[]) => events.map((e) => e.type);

/** A company on the free tier checks out `plan` and pays on the hosted page; nothing delivered yet. */
async function paidCheckout(seats: number) {
  const plan = await newPaidPlan('39.00', seats);
  const company = await createBillingCompany({ planCode: 'bench', customerId: null });
  const actor = await actorFor(company.id);
  const { url, sessionId } = await startCheckout(actor, plan.id);
  expect((await payOnHostedPage(url)).status).toBe(303);
  const session = await getStripe().checkout.sessions.retrieve(sessionId);
  const subId = session.subscription as string;
  const customerId = session.customer as string;
  const events = await eventsAbout([sessionId, subId, customerId]);
  const of = (type: string) => {
    const found = events.filter((e) => e.type === type);
    expect(found, type).toHaveLength(1);
    return found[0];
  };
  return { plan, company, actor, sessionId, subId, customerId, events, of };
}

/** Everything the checkout sent, delivered in the provider's order: an active subscription. */
async function activeSubscription(seats: number) {
  const checkout = await paidCheckout(seats);
  for (const e of checkout.events) expect((await deliver(e)).status).toBe(200);
  expect(await subscriptionRow(checkout.subId)).toMatchObject({ status: 'active', planId: checkout.plan.id });
  return checkout;
}

/** The provider's events about the subscription that are not in `seen`, oldest first. */
async function newEvents(subId: string, seen: Stripe.Event[]): Promise<Stripe.Event[]> {
  const known = new Set(seen.map((e) => e.id));
  return (await eventsAbout([subId])).filter((e) => !known.has(e.id));
}

describe('a new subscription passes through incomplete before active', () => {
  it('the creation (incomplete) grants nothing; the paid first invoice and the update to active grant the plan', async () => {
    const benchId = await planIdByCode('bench');
    const benchSeats = (await getPlanLimits((await createBillingCompany()).id)).seats;
    const { plan, company, sessionId, subId, events, of } = await paidCheckout(7);
    expect(typesOf(events)).toEqual([
      'customer.created',
      'customer.subscription.created',
      'invoice.created',
      'invoice.finalized',
      'invoice.paid',
      'invoice.payment_succeeded',
      'customer.subscription.updated',
      'checkout.session.completed',
    ]);

    const created = of('customer.subscription.created');
    expect((created.data.object as Stripe.Subscription).status).toBe('incomplete');
    expect((await deliver(created)).outcome).toBe('applied');
    // Known, but not live: the company keeps the free tier and its limits.
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'incomplete', planId: plan.id });
    expect(await companyPlanId(company.id)).toBe(benchId);
    expect(await getPlanLimits(company.id)).toMatchObject({ seats: benchSeats, basis: { kind: 'plan' } });

    // Invoice events we do not act on are acknowledged and not stored; invoice.paid is recorded.
    for (const type of ['invoice.created', 'invoice.finalized', 'invoice.payment_succeeded']) {
      const e = of(type);
      expect(await deliver(e), type).toMatchObject({ status: 200 });
      expect(await webhookEventRow(e.id), type).toBeNull();
    }
    const paid = of('invoice.paid');
    expect((paid.data.object as Stripe.Invoice).billing_reason).toBe('subscription_create');
    expect((await deliver(paid)).outcome).toBe('applied');
    expect(await companyPlanId(company.id)).toBe(benchId);

    const activated = of('customer.subscription.updated');
    expect(activated.data.previous_attributes).toEqual({ status: 'incomplete' });
    expect((await deliver(activated)).outcome).toBe('applied');
    const item = (activated.data.object as Stripe.Subscription).items.data[0];
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', planId: plan.id, currentPeriodEnd: toDate(item.current_period_end) });
    expect(await companyPlanId(company.id)).toBe(plan.id);
    expect(await getPlanLimits(company.id)).toMatchObject({ seats: 7, basis: { kind: 'plan' } });

    expect((await deliver(of('checkout.session.completed'))).outcome).toBe('applied');
    expect(await models().BillingCheckout.findOne({ where: { providerSessionId: sessionId } })).toMatchObject({ status: 'completed', providerSubscriptionId: subId });
  });

  it('the update to active arriving before the creation: the older incomplete payload is stale', async () => {
    const { plan, company, subId, of } = await paidCheckout(4);
    const created = of('customer.subscription.created');
    const activated = of('customer.subscription.updated');
    expect(created.created).toBeLessThan(activated.created);
    expect((await deliver(activated)).outcome).toBe('applied');
    expect((await deliver(created)).outcome).toBe('stale');
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active' });
    expect(await companyPlanId(company.id)).toBe(plan.id);
  });

  it('checkout.session.completed after only the incomplete creation fetches the subscription, so the return page does not wait', async () => {
    const { plan, company, sessionId, subId, of } = await paidCheckout(4);
    expect((await deliver(of('customer.subscription.created'))).outcome).toBe('applied');
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'incomplete' });
    expect((await deliver(of('checkout.session.completed'))).outcome).toBe('applied');
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', planId: plan.id });
    expect(await companyPlanId(company.id)).toBe(plan.id);
    expect(await models().BillingCheckout.findOne({ where: { providerSessionId: sessionId } })).toMatchObject({ status: 'completed' });
    // The provider's own update comes later but is older than what was fetched: nothing changes.
    expect((await deliver(of('customer.subscription.updated'))).outcome).toBe('stale');
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active' });
  });
});

describe('a renewal with its invoice events', () => {
  it('moves the period end on and records the paid renewal; the company keeps its plan throughout', async () => {
    const { plan, company, subId, events } = await activeSubscription(6);
    const before = await subscriptionRow(subId);
    const firstEnd = before!.currentPeriodEnd!.getTime();

    await fakeHook(`/_fake/subscriptions/${subId}/advance`);
    const renewal = await newEvents(subId, events);
    expect(typesOf(renewal)).toEqual(['customer.subscription.updated', 'invoice.created', 'invoice.finalized', 'invoice.paid', 'invoice.payment_succeeded']);
    const invoice = renewal[3].data.object as Stripe.Invoice;
    expect(invoice).toMatchObject({ billing_reason: 'subscription_cycle', status: 'paid', period_start: firstEnd / 1000 });
    for (let i = 1; i < renewal.length; i++) expect(renewal[i].created).toBeGreaterThan(renewal[i - 1].created);

    const outcomes: Record<string, string | undefined> = {};
    for (const e of renewal) {
      const res = await deliver(e);
      expect(res.status).toBe(200);
      outcomes[e.type] = res.outcome;
      // Between the events the company never loses its plan.
      expect(await companyPlanId(company.id)).toBe(plan.id);
    }
    expect(outcomes).toMatchObject({ 'customer.subscription.updated': 'applied', 'invoice.paid': 'applied' });
    const after = await subscriptionRow(subId);
    expect(after).toMatchObject({ status: 'active', planId: plan.id, lastPaymentFailedAt: null });
    expect(after!.currentPeriodEnd!.getTime()).toBe(firstEnd + 30 * 86_400_000);
    expect(await webhookEventRow(renewal[3].id)).toMatchObject({ type: 'invoice.paid', outcome: 'applied' });
    expect(await webhookEventRow(renewal[1].id)).toBeNull();
  });

  it('delivered newest first, the renewal ends in the same state', async () => {
    const { plan, subId, events } = await activeSubscription(6);
    const firstEnd = (await subscriptionRow(subId))!.currentPeriodEnd!.getTime();
    await fakeHook(`/_fake/subscriptions/${subId}/advance`);
    const renewal = await newEvents(subId, events);
    expect(renewal).toHaveLength(5);
    for (const e of [...renewal].reverse()) expect((await deliver(e)).status).toBe(200);
    const after = await subscriptionRow(subId);
    expect(after).toMatchObject({ status: 'active', planId: plan.id, lastPaymentFailedAt: null });
    expect(after!.currentPeriodEnd!.getTime()).toBe(firstEnd + 30 * 86_400_000);
  });

  it('a declined renewal, then a renewal that is paid: past due with a grace period, then back to the plan with the failure cleared', async () => {
    const { plan, company, subId, events } = await activeSubscription(6);
    await fakeHook(`/_fake/subscriptions/${subId}/fail_payment`);
    const failed = await newEvents(subId, events);
    expect(typesOf(failed)).toEqual(['customer.subscription.updated', 'invoice.created', 'invoice.finalized', 'invoice.payment_failed', 'customer.subscription.updated']);
    for (const e of failed) expect((await deliver(e)).status).toBe(200);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'past_due' });
    expect((await subscriptionRow(subId))?.lastPaymentFailedAt).toBeInstanceOf(Date);
    expect((await getPlanLimits(company.id)).basis.kind).toBe('past_due_grace');

    await fakeHook(`/_fake/subscriptions/${subId}/recover_payment`);
    const recovered = await newEvents(subId, [...events, ...failed]);
    expect(typesOf(recovered)).toEqual(['invoice.paid', 'invoice.payment_succeeded', 'customer.subscription.updated']);
    for (const e of recovered) expect((await deliver(e)).status).toBe(200);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', planId: plan.id, lastPaymentFailedAt: null, graceEndsAt: null });
    expect(await getPlanLimits(company.id)).toMatchObject({ seats: 6, basis: { kind: 'plan' } });
  });
});

describe('pause and resume', () => {
  it('while paused the free tier\'s limits apply; resumed, the plan is back with a new period', async () => {
    const benchSeats = (await getPlanLimits((await createBillingCompany()).id)).seats;
    const { plan, company, subId, events } = await activeSubscription(8);

    await getStripe().subscriptions.pause(subId);
    const paused = await newEvents(subId, events);
    expect(typesOf(paused)).toEqual(['customer.subscription.updated', 'customer.subscription.paused']);
    // The paused event alone is enough: deliver it first, then the (older) update is stale.
    expect((await deliver(paused[1])).outcome).toBe('applied');
    expect((await deliver(paused[0])).outcome).toBe('stale');
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'paused' });
    expect(await getPlanLimits(company.id)).toMatchObject({ seats: benchSeats, basis: { kind: 'paused' } });

    await getStripe().subscriptions.resume(subId);
    const resumed = await newEvents(subId, [...events, ...paused]);
    expect(typesOf(resumed)).toEqual([
      'customer.subscription.updated',
      'customer.subscription.resumed',
      'invoice.created',
      'invoice.finalized',
      'invoice.paid',
      'invoice.payment_succeeded',
    ]);
    expect((await deliver(resumed[1])).outcome).toBe('applied');
    for (const e of resumed) expect((await deliver(e)).status).toBe(200);
    const row = await subscriptionRow(subId);
    expect(row).toMatchObject({ status: 'active', planId: plan.id });
    // Resumed with the billing cycle anchored today: the period is the one the provider started.
    const item = (resumed[1].data.object as Stripe.Subscription).items.data[0];
    expect(row!.currentPeriodEnd).toEqual(toDate(item.current_period_end));
    expect(await getPlanLimits(company.id)).toMatchObject({ seats: 8, basis: { kind: 'plan' } });
  });
});
