import { asSignedOut, asUser, callAction, callPage, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { changePlanAction, openPortalAction, startCheckoutAction } from '@/server/actions/billing';
import { createPlanAction, syncPlanAction, updatePlanAction } from '@/server/actions/plans';
import { getStripe } from '@/server/billing/stripe';
import { getPlanLimits } from '@/server/billing/limits';
import CheckoutReturnPage from '@/app/(app)/settings/billing/return/page';
import { createStaffUser, createUserWithRole, signInAs } from './support/factories';
import { createBillingCompany, planIdByCode, rand } from './billing-fixtures';

/**
 * The billing and plan-catalogue actions as the browser calls them: who may call which, what a
 * refusal looks like, and that one company never reaches another's checkout.
 */
const madePlans: number[] = [];
afterAll(async () => {
  if (madePlans.length) await models().Plan.update({ isPublic: false }, { where: { id: madePlans } });
  await closeSequelize();
});
beforeEach(() => setRequestHeaders({}));

async function companyWith(role: 'admin' | 'installer' | 'sales', planCode = 'bench') {
  const company = await createBillingCompany({ planCode, customerId: null });
  const user = await createUserWithRole(company.id, role);
  asUser(await signInAs(user));
  return { company, user };
}

describe('billing actions: admins only', () => {
  it('refuses installers and sales (403) and signed-out callers (401) without touching the provider', async () => {
    const crewId = await planIdByCode('crew');
    const companies: number[] = [];
    for (const role of ['installer', 'sales'] as const) {
      companies.push((await companyWith(role)).company.id);
      for (const action of [startCheckoutAction, changePlanAction]) {
        expect((await callAction(action, { planId: crewId })).state).toMatchObject({ ok: false, code: 'forbidden' });
      }
      expect((await callAction(openPortalAction, {})).state).toMatchObject({ ok: false, code: 'forbidden' });
    }
    asSignedOut();
    expect((await callAction(startCheckoutAction, { planId: crewId })).state).toMatchObject({ ok: false, code: 'unauthenticated' });
    expect(await models().BillingCheckout.count({ where: { companyId: companies } })).toBe(0);
    const [[row]] = (await models().sequelize.query('SELECT COUNT(*) AS n FROM companies WHERE id IN (?) AND stripe_customer_id IS NOT NULL', { replacements: [companies] })) as [{ n: number }[], unknown];
    expect(Number(row.n)).toBe(0);
  });

  it('an admin is redirected to the hosted checkout; a free or unknown plan is refused', async () => {
    const { company } = await companyWith('admin');
    const out = await callAction(startCheckoutAction, { planId: await planIdByCode('crew') });
    expect(out.redirect).toMatch(/\/checkout\/cs_test_/);
    expect(await models().BillingCheckout.count({ where: { companyId: company.id } })).toBe(1);
    expect((await callAction(startCheckoutAction, { planId: await planIdByCode('bench') })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(startCheckoutAction, { planId: 99_999_999 })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(startCheckoutAction, { planId: 'crew' })).state).toMatchObject({ ok: false, code: 'invalid_input' });
  });

  it('change plan without a subscription, and the portal without a billing account, are refused with a reason', async () => {
    await companyWith('admin');
    const change = (await callAction(changePlanAction, { planId: await planIdByCode('fleet') })).state;
    expect(change).toMatchObject({ ok: false, code: 'conflict' });
    expect(change && !change.ok && change.error).toMatch(/no subscription to change yet/);
    expect((await callAction(openPortalAction, {})).state).toMatchObject({ ok: false, code: 'conflict' });
  });

  it('the return page shows only the company\'s own checkout (another company gets a 404)', async () => {
    const a = await companyWith('admin');
    const out = await callAction(startCheckoutAction, { planId: await planIdByCode('crew') });
    const sessionId = /cs_test_[A-Za-z0-9]+/.exec(out.redirect ?? '')![0];
    const own = await callPage(() => CheckoutReturnPage({ searchParams: Promise.resolve({ session_id: sessionId }) }));
    expect('value' in own).toBe(true);
    await companyWith('admin');
    const other = await callPage(() => CheckoutReturnPage({ searchParams: Promise.resolve({ session_id: sessionId }) }));
    expect(other).toEqual({ notFound: 404 });
    expect(a.company.id).toBeGreaterThan(0);
  });
});

describe('plan catalogue actions: staff only', () => {
  const fields = (over: Record<string, string> = {}) => ({
    code: `st-${rand()}`, kind: 'paid', name: 'Relay', description: 'Invented plan for a staff test.', monthlyPriceUsd: '79', seatLimit: '10',
    studiesPerMonth: '800', activeLinksLimit: '120', uploadsPerMonth: '60', campaignSitesLimit: '250000', apiAccess: 'on', quoteBranding: 'on', isPublic: '', sortOrder: '50', trialDays: '', ...over,
  });

  it('a company admin may not create or change plans', async () => {
    await companyWith('admin');
    expect((await callAction(createPlanAction, fields())).state).toMatchObject({ ok: false, code: 'forbidden' });
    expect((await callAction(updatePlanAction, { id: await planIdByCode('crew'), ...fields() })).state).toMatchObject({ ok: false, code: 'forbidden' });
  });

  it('staff create a plan (synced as product + price), then a new amount makes a new price', async () => {
    asUser(await signInAs(await createStaffUser()));
    const created = await callAction<{ planId: number }>(createPlanAction, fields());
    expect(created.state).toMatchObject({ ok: true });
    const planId = created.state!.ok ? created.state!.data!.planId : 0;
    madePlans.push(planId);
    const plan = await models().Plan.findByPk(planId, { rejectOnEmpty: true });
    expect(plan).toMatchObject({ name: 'Relay', seatLimit: 10, apiAccess: true, isPublic: false, campaignSitesLimit: 250_000 });
    expect((await getStripe().prices.retrieve(plan.stripePriceId!)).unit_amount).toBe(7900);

    const updated = await callAction(updatePlanAction, { id: String(planId), ...fields({ monthlyPriceUsd: '84.50', name: 'Relay Plus', campaignSitesLimit: '1000000' }) });
    expect(updated.state).toMatchObject({ ok: true });
    expect(updated.state?.ok && updated.state.message).toMatch(/new monthly price was created .* old one archived/);
    await plan.reload();
    expect(plan.name).toBe('Relay Plus');
    // The edited cap is the one a company on the plan gets (what the campaign upload checks).
    expect(plan.campaignSitesLimit).toBe(1_000_000);
    const onPlan = await createBillingCompany({ planCode: plan.code, customerId: null });
    expect((await getPlanLimits(onPlan.id)).campaignSites).toBe(1_000_000);
    expect((await getStripe().prices.retrieve(plan.stripePriceId!)).unit_amount).toBe(8450);
    expect((await callAction(syncPlanAction, { id: planId })).state).toMatchObject({ ok: true });
  });

  it('validation: a paid plan needs a price, a free plan costs nothing, codes are unique', async () => {
    asUser(await signInAs(await createStaffUser()));
    const zero = (await callAction(createPlanAction, fields({ monthlyPriceUsd: '0' }))).state;
    expect(zero).toMatchObject({ ok: false, fieldErrors: { monthlyPriceUsd: ['A paid plan needs a monthly price above 0.'] } });
    const freeWithPrice = (await callAction(createPlanAction, fields({ kind: 'free', monthlyPriceUsd: '5' }))).state;
    expect(freeWithPrice).toMatchObject({ ok: false, fieldErrors: { monthlyPriceUsd: ['Free and trial plans cost 0.00.'] } });
    expect((await callAction(createPlanAction, fields({ code: 'crew' }))).state).toMatchObject({ ok: false, fieldErrors: { code: ['Already used.'] } });
    expect((await callAction(createPlanAction, fields({ seatLimit: '0' }))).state).toMatchObject({ ok: false, code: 'invalid_input' });
    expect((await callAction(createPlanAction, fields({ campaignSitesLimit: '1000001' }))).state).toMatchObject({ ok: false, fieldErrors: { campaignSitesLimit: ['Sites per campaign must be at most 1,000,000.'] } });
    expect((await callAction(createPlanAction, fields({ campaignSitesLimit: '2.5' }))).state).toMatchObject({ ok: false, fieldErrors: { campaignSitesLimit: ['Sites per campaign must be a whole number.'] } });
    // An edit that leaves the field out does not quietly reset the cap to a default.
    const crew = await planIdByCode('crew');
    const { campaignSitesLimit: _left, ...withoutCap } = fields();
    expect((await callAction(updatePlanAction, { id: String(crew), ...withoutCap })).state).toMatchObject({ ok: false, fieldErrors: { campaignSitesLimit: [expect.any(String)] } });
  });
});
