import { asUser, callAction, callPage, setRequestHeaders } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { changeAccountPlanAction, extendTrialAction } from '@/server/actions/staff-accounts';
import { startCheckout } from '@/server/billing/checkout';
import { getStripe } from '@/server/billing/stripe';
import { listAuditEventsForCompany } from '@/db/queries/audit';
import AccountPage from '@/app/(staff)/accounts/[companyId]/page';
import { createStaffUser, createUserWithRole, signInAs, type TestUser } from './support/factories';
import { actorFor, companyPlanId, createBillingCompany, deliver, eventsAbout, hideMadePlans, newPaidPlan, payOnHostedPage, planIdByCode, subscriptionRow } from './billing-fixtures';

/**
 * The operator's account actions: staff only, each in a transaction with its audit row (reason
 * included), written for the company so its admins see it too. A plan change for a company that
 * pays through the provider goes to the provider and applies with its webhook.
 */
afterAll(async () => {
  await hideMadePlans();
  await closeSequelize();
});

let staff: TestUser;
let staffToken: string;
const DAY = 86_400_000;

beforeAll(async () => {
  staff = await createStaffUser();
  staffToken = await signInAs(staff);
});
beforeEach(() => setRequestHeaders({ 'x-forwarded-for': '198.51.100.77' }));

type Row = { action: string; actor_user_id: string | null; target_label: string | null; detail: string | null; ip: string | null };
async function auditRows(companyId: number, action: string): Promise<Row[]> {
  return models().sequelize.query<Row>('SELECT action, actor_user_id, target_label, detail, ip FROM audit_events WHERE company_id = :companyId AND action = :action ORDER BY id', {
    replacements: { companyId, action },
    type: QueryTypes.SELECT,
  });
}
const trialEnd = async (companyId: number) => (await models().Company.findByPk(companyId, { rejectOnEmpty: true })).trialEndsAt;

describe('extend a trial', () => {
  it('staff add days to the current end, with the reason in the company’s own audit log', async () => {
    // Whole seconds: the column keeps no fraction.
    const end = new Date(Math.floor((Date.now() + 3 * DAY) / 1000) * 1000);
    const company = await createBillingCompany({ planCode: 'trial', trialEndsAt: end, customerId: null });
    asUser(staffToken);
    const out = await callAction(extendTrialAction, { companyId: company.id, days: '10', reason: 'Waiting on their site survey' });
    expect(out.state, JSON.stringify(out.state)).toMatchObject({ ok: true });
    expect((await trialEnd(company.id))!.getTime()).toBe(end.getTime() + 10 * DAY);
    const [row] = await auditRows(company.id, 'staff.trial_extended');
    expect(row).toMatchObject({ actor_user_id: staff.id, ip: '198.51.100.77' });
    expect(JSON.parse(row.detail!)).toMatchObject({ days: 10, reason: 'Waiting on their site survey' });
    // The company's admins read the same row in their log.
    const theirs = await listAuditEventsForCompany(company.id, { prefixes: ['staff.'] });
    expect(theirs.map((e) => e.action)).toEqual(['staff.trial_extended']);
  });

  it('an ended trial is extended from today', async () => {
    const company = await createBillingCompany({ planCode: 'trial', trialEndsAt: new Date(Date.now() - 20 * DAY), customerId: null });
    asUser(staffToken);
    const before = Date.now();
    expect((await callAction(extendTrialAction, { companyId: company.id, days: '7', reason: 'Came back after the holidays' })).state?.ok).toBe(true);
    const t = (await trialEnd(company.id))!.getTime();
    expect(t).toBeGreaterThanOrEqual(before + 7 * DAY - 1000);
    expect(t).toBeLessThanOrEqual(Date.now() + 7 * DAY + 1000);
  });

  it('refuses a company that is not on a trial, a missing reason, too many days, and an unknown company — changing nothing', async () => {
    const paid = await createBillingCompany({ planCode: 'crew', customerId: null });
    asUser(staffToken);
    expect((await callAction(extendTrialAction, { companyId: paid.id, days: '5', reason: 'Please extend' })).state).toMatchObject({ ok: false, code: 'conflict' });
    const trial = await createBillingCompany({ planCode: 'trial', trialEndsAt: new Date(Date.now() + DAY), customerId: null });
    const before = await trialEnd(trial.id);
    expect((await callAction(extendTrialAction, { companyId: trial.id, days: '5', reason: '' })).state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { reason: expect.any(Array) } });
    expect((await callAction(extendTrialAction, { companyId: trial.id, days: '400', reason: 'A long one' })).state).toMatchObject({ ok: false, fieldErrors: { days: expect.any(Array) } });
    expect((await callAction(extendTrialAction, { companyId: 999_999_999, days: '5', reason: 'Nobody' })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect(await trialEnd(trial.id)).toEqual(before);
    expect(await auditRows(paid.id, 'staff.trial_extended')).toHaveLength(0);
    expect(await auditRows(trial.id, 'staff.trial_extended')).toHaveLength(0);
  });

  it('is refused to company roles (403 forbidden), even the company’s own admin', async () => {
    const company = await createBillingCompany({ planCode: 'trial', trialEndsAt: new Date(Date.now() + DAY), customerId: null });
    const before = await trialEnd(company.id);
    for (const role of ['admin', 'installer', 'sales'] as const) {
      asUser(await signInAs(await createUserWithRole(company.id, role)));
      expect((await callAction(extendTrialAction, { companyId: company.id, days: '30', reason: 'I would like more' })).state).toMatchObject({ ok: false, code: 'forbidden' });
      expect((await callAction(changeAccountPlanAction, { companyId: company.id, planId: await planIdByCode('fleet'), reason: 'Upgrade me for free' })).state).toMatchObject({ ok: false, code: 'forbidden' });
    }
    expect(await trialEnd(company.id)).toEqual(before);
    expect(await companyPlanId(company.id)).toBe(await planIdByCode('trial'));
  });
});

describe('change a plan', () => {
  it('assigns the plan at once to a company without a subscription, audited with the reason', async () => {
    const company = await createBillingCompany({ planCode: 'bench', customerId: null });
    const fleet = await planIdByCode('fleet');
    asUser(staffToken);
    const out = await callAction(changeAccountPlanAction, { companyId: company.id, planId: fleet, reason: 'Pilot agreed by sales for Q1' });
    expect(out.state).toMatchObject({ ok: true, data: { via: 'assigned' } });
    expect(await companyPlanId(company.id)).toBe(fleet);
    const [row] = await auditRows(company.id, 'staff.plan_changed');
    expect(row).toMatchObject({ actor_user_id: staff.id, ip: '198.51.100.77' });
    expect(JSON.parse(row.detail!)).toMatchObject({ planId: fleet, fromPlanId: await planIdByCode('bench'), reason: 'Pilot agreed by sales for Q1' });
    expect((await callAction(changeAccountPlanAction, { companyId: company.id, planId: fleet, reason: 'Again' })).state).toMatchObject({ ok: false, code: 'conflict' });
    expect(await auditRows(company.id, 'staff.plan_changed')).toHaveLength(1);
  });

  it('moving to the trial plan starts a fresh trial of its length', async () => {
    const company = await createBillingCompany({ planCode: 'bench', customerId: null });
    const trialPlan = await models().Plan.findOne({ where: { code: 'trial' }, rejectOnEmpty: true });
    asUser(staffToken);
    expect((await callAction(changeAccountPlanAction, { companyId: company.id, planId: trialPlan.id, reason: 'Second look at the product' })).state?.ok).toBe(true);
    const end = (await trialEnd(company.id))!.getTime();
    expect(Math.abs(end - (Date.now() + (trialPlan.trialDays ?? 14) * DAY))).toBeLessThan(60_000);
  });

  it('for a paying company goes through the provider: pending, then applied by the webhook; free plans are refused', async () => {
    const from = await newPaidPlan('39.00', 4);
    const to = await newPaidPlan('89.00', 12);
    const company = await createBillingCompany({ planCode: 'bench', customerId: null });
    const { url, sessionId } = await startCheckout(await actorFor(company.id), from.id);
    expect((await payOnHostedPage(url)).status).toBe(303);
    const subId = (await getStripe().checkout.sessions.retrieve(sessionId)).subscription as string;
    const session = await getStripe().checkout.sessions.retrieve(sessionId);
    for (const e of await eventsAbout([sessionId, subId, session.customer as string])) await deliver(e);
    expect(await companyPlanId(company.id)).toBe(from.id);
    // The provider's events are audited as the payment provider's.
    expect((await auditRows(company.id, 'billing.plan_changed')).length).toBeGreaterThanOrEqual(1);
    expect((await auditRows(company.id, 'billing.subscription_status')).length).toBeGreaterThanOrEqual(1);
    expect(await auditRows(company.id, 'billing.checkout_started')).toHaveLength(1);

    asUser(staffToken);
    const free = await planIdByCode('bench');
    expect((await callAction(changeAccountPlanAction, { companyId: company.id, planId: free, reason: 'They asked to stop' })).state).toMatchObject({ ok: false, code: 'conflict' });
    const out = await callAction(changeAccountPlanAction, { companyId: company.id, planId: to.id, reason: 'Upgrade agreed on the phone' });
    expect(out.state, JSON.stringify(out.state)).toMatchObject({ ok: true, data: { via: 'provider' } });
    expect(await companyPlanId(company.id)).toBe(from.id);
    expect((await subscriptionRow(subId))?.pendingPlanId).toBe(to.id);
    const [requested] = await auditRows(company.id, 'staff.plan_change_requested');
    expect(JSON.parse(requested.detail!)).toMatchObject({ planId: to.id, reason: 'Upgrade agreed on the phone' });
    const remote = await getStripe().subscriptions.retrieve(subId);
    expect(remote.items.data[0].price.id).toBe((await models().Plan.findByPk(to.id))!.stripePriceId);

    const [changed] = await eventsAbout([subId], ['customer.subscription.updated']).then((l) => l.slice(-1));
    expect(['applied', 'duplicate']).toContain((await deliver(changed)).outcome);
    expect(await companyPlanId(company.id)).toBe(to.id);
    const applied = await auditRows(company.id, 'billing.plan_changed');
    expect(JSON.parse(applied.at(-1)!.detail!)).toMatchObject({ planId: to.id, fromPlanId: from.id });
    expect(applied.at(-1)!.target_label).toBe((await models().Plan.findByPk(to.id))!.name);
  });
});

describe('account page', () => {
  it('shows staff a company’s account; a company member gets a 404, as does an unknown id', async () => {
    const company = await createBillingCompany({ planCode: 'trial', trialEndsAt: new Date(Date.now() + DAY), customerId: null });
    await createUserWithRole(company.id, 'admin', { name: 'Page Admin' });
    asUser(staffToken);
    const shown = await callPage(() => AccountPage({ params: Promise.resolve({ companyId: String(company.id) }) }));
    expect(shown).toHaveProperty('value');
    expect(await callPage(() => AccountPage({ params: Promise.resolve({ companyId: '999999999' }) }))).toEqual({ notFound: 404 });
    asUser(await signInAs(await createUserWithRole(company.id, 'admin')));
    expect(await callPage(() => AccountPage({ params: Promise.resolve({ companyId: String(company.id) }) }))).toEqual({ notFound: 404 });
  });
});
