import { afterAll, describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { changePlan, openBillingPortal, startCheckout } from '@/server/billing/checkout';
import { getPlanLimits } from '@/server/billing/limits';
import { syncPlanToProvider } from '@/server/billing/plan-sync';
import { getStripe } from '@/server/billing/stripe';
import { isHandledEventType } from '@/server/billing/webhook';
import {
  actorFor,
  companyPlanId,
  createBillingCompany,
  deliver,
  eventOf,
  eventsAbout,
  fakeHook,
  hideMadePlans,
  newPaidPlan,
  payOnHostedPage,
  planIdByCode,
  rand,
  subscriptionRow,
} from './billing-fixtures';

/**
 * The whole subscription flow through the official SDK against the local Stripe-compatible
 * service (the same calls would go to Stripe's test mode): plan sync, checkout paid on the hosted
 * page, plan change, a failed renewal and its recovery, cancellation in the portal. The events the
 * provider sent are then delivered to our webhook route in a chosen order.
 */
afterAll(async () => {
  await hideMadePlans();
  await closeSequelize();
});

describe('plan sync to the provider', () => {
  it('creates product and monthly price; the same amount keeps the price; a new amount makes a new price and archives the old', async () => {
    const plan = await newPaidPlan('19.00');
    const first = await syncPlanToProvider(plan.id);
    expect(first.productId).toMatch(/^prod_/);
    expect(first.createdPrice).toBe(true);
    const stripe = getStripe();
    const price = await stripe.prices.retrieve(first.priceId!);
    expect(price).toMatchObject({ unit_amount: 1900, currency: 'usd', active: true, product: first.productId, recurring: { interval: 'month' } });
    expect((await stripe.products.retrieve(first.productId!)).name).toBe(plan.name);

    const again = await syncPlanToProvider(plan.id);
    expect(again).toMatchObject({ productId: first.productId, priceId: first.priceId, createdPrice: false });

    await plan.update({ monthlyPriceUsd: '24.50', name: `${plan.name} renamed` });
    const changed = await syncPlanToProvider(plan.id);
    expect(changed.priceId).not.toBe(first.priceId);
    expect(changed.archivedPriceId).toBe(first.priceId);
    expect((await stripe.prices.retrieve(changed.priceId!)).unit_amount).toBe(2450);
    expect((await stripe.prices.retrieve(first.priceId!)).active).toBe(false);
    const product = await stripe.products.retrieve(first.productId!);
    expect(product.name).toBe(`${plan.name}`);
    expect(product.default_price).toBe(changed.priceId);
    await plan.reload();
    expect(plan.stripePriceId).toBe(changed.priceId);
  });

  it('recreates product and price when the stored ids are unknown to the provider (other account or mode)', async () => {
    const plan = await newPaidPlan('9.00');
    await plan.update({ stripeProductId: `prod_gone_${rand()}`, stripePriceId: `price_gone_${rand()}` });
    const synced = await syncPlanToProvider(plan.id);
    expect(synced.productId).not.toMatch(/gone/);
    expect((await getStripe().prices.retrieve(synced.priceId!)).unit_amount).toBe(900);
  });
});

describe('checkout → webhooks → active plan → change → failed renewal → cancel', () => {
  it('runs the whole subscription through the provider and ends on the free tier', async () => {
    const crewLike = await newPaidPlan('49.00', 5);
    const fleetLike = await newPaidPlan('149.00', 25);
    const benchId = await planIdByCode('bench');
    const company = await createBillingCompany({ planCode: 'bench', customerId: null });
    const actor = await actorFor(company.id);

    // 1. Checkout: a session on the provider, a row we can wait on.
    const { url, sessionId } = await startCheckout(actor, crewLike.id);
    expect(url).toContain(`/checkout/${sessionId}`);
    const checkoutRow = await models().BillingCheckout.findOne({ where: { providerSessionId: sessionId } });
    expect(checkoutRow).toMatchObject({ companyId: company.id, planId: crewLike.id, status: 'open' });
    const session = await getStripe().checkout.sessions.retrieve(sessionId);
    expect(session.client_reference_id).toBe(String(company.id));
    expect(session.customer).toMatch(/^cus_/);

    // 2. Pay on the hosted test page, as the browser would.
    const paid = await payOnHostedPage(url);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${process.env.APP_URL}/settings/billing/return?session_id=${sessionId}`);
    const subId = (await getStripe().checkout.sessions.retrieve(sessionId)).subscription as string;
    expect(subId).toMatch(/^sub_/);

    // 3. Deliver the provider's events with checkout.session.completed FIRST: the return page
    //    must not depend on the subscription event arriving before it.
    const events = await eventsAbout([sessionId, subId, session.customer as string]);
    const completed = events.find((e) => e.type === 'checkout.session.completed')!;
    expect(completed).toBeDefined();
    expect((await deliver(completed)).status).toBe(200);
    expect(await companyPlanId(company.id)).toBe(crewLike.id);
    expect(await models().BillingCheckout.findOne({ where: { providerSessionId: sessionId } })).toMatchObject({ status: 'completed', providerSubscriptionId: subId });
    for (const e of events.filter((x) => x !== completed)) expect((await deliver(e)).status).toBe(200);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', planId: crewLike.id, cancelAtPeriodEnd: false });
    expect((await getPlanLimits(company.id)).seats).toBe(5);
    await expect(startCheckout(actor, fleetLike.id)).rejects.toMatchObject({ code: 'conflict' });

    // 4. Change plan: pending until the provider's update arrives.
    await changePlan(actor, fleetLike.id);
    expect((await subscriptionRow(subId))?.pendingPlanId).toBe(fleetLike.id);
    const [changed] = await eventsAbout([subId], ['customer.subscription.updated']).then((l) => l.slice(-1));
    // 'duplicate' if an app on APP_URL already received the provider's own delivery of it.
    expect(['applied', 'duplicate']).toContain((await deliver(changed)).outcome);
    expect(await companyPlanId(company.id)).toBe(fleetLike.id);
    expect((await subscriptionRow(subId))?.pendingPlanId).toBeNull();

    // 5. Same-second tie: an event carrying the old plan, stamped with the same `created` as the
    //    newest applied one, cannot be ordered — the provider's current state is fetched instead.
    const oldPayload = structuredClone(changed.data.object) as Stripe.Subscription;
    oldPayload.items.data[0].price = { ...oldPayload.items.data[0].price, id: crewLike.stripePriceId ?? 'price_x', product: (await crewLike.reload()).stripeProductId! };
    const tie = eventOf('customer.subscription.updated', oldPayload, changed.created);
    expect((await deliver(tie)).outcome).toBe('applied');
    expect(await companyPlanId(company.id)).toBe(fleetLike.id);

    // 6. The renewal fails: past due with a grace period; then the invoice is paid.
    await fakeHook(`/_fake/subscriptions/${subId}/fail_payment`);
    for (const e of await eventsAbout([subId], ['invoice.payment_failed', 'customer.subscription.updated'])) await deliver(e);
    const pastDue = await subscriptionRow(subId);
    expect(pastDue).toMatchObject({ status: 'past_due' });
    expect(pastDue?.graceEndsAt).toBeInstanceOf(Date);
    expect(pastDue?.lastPaymentFailedAt).toBeInstanceOf(Date);
    expect((await getPlanLimits(company.id)).basis.kind).toBe('past_due_grace');
    await fakeHook(`/_fake/subscriptions/${subId}/recover_payment`);
    for (const e of await eventsAbout([subId], ['invoice.paid', 'customer.subscription.updated'])) await deliver(e);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', graceEndsAt: null, lastPaymentFailedAt: null });

    // 7. Cancel at period end in the portal, then the period ends: back to the free tier.
    const portalUrl = await openBillingPortal(actor);
    const cancel = await fetch(`${portalUrl}/subscriptions/${subId}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(cancel.status).toBe(303);
    for (const e of await eventsAbout([subId], ['customer.subscription.updated'])) await deliver(e);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'active', cancelAtPeriodEnd: true });
    expect(await companyPlanId(company.id)).toBe(fleetLike.id);
    await fakeHook(`/_fake/subscriptions/${subId}/advance`);
    for (const e of await eventsAbout([subId], ['customer.subscription.deleted'])) await deliver(e);
    expect(await subscriptionRow(subId)).toMatchObject({ status: 'canceled' });
    expect(await companyPlanId(company.id)).toBe(benchId);
    // The audit log tells the same story: the admin's checkout and plan change, the provider's
    // status moves, plan changes and the failed payment (the webhook's rows in its transaction).
    const logged = (await models().AuditEvent.findAll({ where: { companyId: company.id }, order: [['id', 'ASC']] })).map((e) => e.action);
    expect(logged).toEqual(expect.arrayContaining(['billing.checkout_started', 'billing.plan_change_requested', 'billing.payment_failed', 'billing.subscription_status', 'billing.plan_changed']));
    const planRows = await models().AuditEvent.findAll({ where: { companyId: company.id, action: 'billing.plan_changed' }, order: [['id', 'ASC']] });
    expect(planRows.map((r) => r.targetLabel)).toEqual([crewLike.name, fleetLike.name, (await models().Plan.findByPk(benchId))!.name]);
    expect(planRows.every((r) => r.actorLabel === 'Payment provider' && r.actorUserId === null)).toBe(true);
    // Every event of this subscription was stored once, however often it was delivered.
    const { WebhookEvent } = models();
    const ids = (await eventsAbout([sessionId, subId])).filter((e) => isHandledEventType(e.type)).map((e) => e.id);
    expect(await WebhookEvent.count({ where: { providerEventId: ids } })).toBe(new Set(ids).size);
  });
});

describe('one open checkout per company', () => {
  it('a second checkout (double click, two admins at once) expires the first at the provider, so only one can be paid', async () => {
    const crewLike = await newPaidPlan('49.00', 5);
    const company = await createBillingCompany({ planCode: 'bench', customerId: null });
    const actor = await actorFor(company.id);
    const [a, b] = await Promise.all([startCheckout(actor, crewLike.id), startCheckout(actor, crewLike.id)]);
    const stripe = getStripe();
    const atProvider = await Promise.all([a, b].map(async (s) => ({ id: s.sessionId, status: (await stripe.checkout.sessions.retrieve(s.sessionId)).status })));
    expect(atProvider.map((s) => s.status).sort()).toEqual(['expired', 'open']);
    // Our rows agree with the provider, session by session.
    const rows = await models().BillingCheckout.findAll({ where: { companyId: company.id }, order: [['id', 'ASC']] });
    expect(rows.map((r) => r.status)).toEqual(['expired', 'open']);
    for (const s of atProvider) expect(rows.find((r) => r.providerSessionId === s.id)?.status).toBe(s.status);
  });
});
