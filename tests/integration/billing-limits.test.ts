import { asUser, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { inviteMember } from '@/server/actions/team';
import { getPlanLimits, getPlanUsage, type LimitName } from '@/server/billing/limits';
import { assertWithinPlan } from '@/server/plan-limit';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { createStudy } from '@/server/studies/create-study';
import { PlanLimitError } from '@/server/errors';
import { createClimateProfile } from '@/db/queries/climate-profiles';
import { createDish } from '@/db/queries/dishes';
import { createServiceProfile } from '@/db/queries/service-profiles';
import { climateProfileSchema } from '@/server/validation/climate';
import { serviceProfileSchema } from '@/server/validation/service-profile';
import { newStudySchema } from '@/server/validation/study';
import { POST as webhook } from '@/app/api/webhooks/stripe/route';
import { createUserWithRole, signInAs, uniqueEmail } from './support/factories';
import { createBillingCompany, createTestPlan, eventOf, planIdByCode, rand, subscriptionObject, webhookRequest } from './billing-fixtures';

/**
 * Plan limits on the real MariaDB: enforced atomically under concurrency (company row locked
 * FOR UPDATE in the caller's transaction), named in the error with how to raise them, and the
 * fall-back to the free tier after a trial ends or a payment stays overdue past the grace period.
 */
afterAll(closeSequelize);
beforeEach(() => setRequestHeaders({}));

async function refusal(run: () => Promise<unknown>): Promise<PlanLimitError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof PlanLimitError) return error;
    throw error;
  }
  throw new Error('expected a PlanLimitError, but the call succeeded');
}

const inTransaction = <T,>(fn: (t: Transaction) => Promise<T>) => models().sequelize.transaction(fn);
const check = (companyId: number, limit: LimitName) => inTransaction(async (t) => assertWithinPlan(await lockCompanyRow(companyId, t), limit));

describe('seats: members plus pending invitations', () => {
  it('20 parallel invitations through the invite action at a 5-seat limit fill exactly the 5 seats', async () => {
    const plan = await createTestPlan({ seats: 5 });
    const company = await createBillingCompany({ planId: plan.id });
    const admin = await createUserWithRole(company.id, 'admin');
    asUser(await signInAs(admin));
    const emails = Array.from({ length: 20 }, () => uniqueEmail('crowd'));
    const results = await Promise.all(emails.map((email) => callAction(inviteMember, { email, role: 'sales' })));
    const ok = results.filter((r) => r.state?.ok);
    const refused = results.filter((r) => r.state && !r.state.ok);
    // The admin holds one seat, so 4 invitations fit: 1 member + 4 pending = the 5 seats.
    expect(ok).toHaveLength(4);
    expect(refused).toHaveLength(16);
    for (const r of refused) expect(r.state).toMatchObject({ ok: false, code: 'plan_limit' });
    expect(refused[0].state && !refused[0].state.ok && refused[0].state.error).toMatch(/All 5 seats of the .* plan are taken/);
    const { Invitation } = models();
    expect(await Invitation.count({ where: { companyId: company.id, revokedAt: null } })).toBe(4);
    expect((await getPlanUsage(company.id)).seats).toBe(5);
  });
});

// ---- studies: the studies service calls assertWithinPlan inside its own transaction ----------

async function studyInputsFor(companyId: number) {
  // Invented demo-style inputs: a Ku-band DTH service and a known R0.01 climate.
  const service = await createServiceProfile(companyId, serviceProfileSchema.parse({
    name: `Test Ku DTH ${rand()}`, satelliteName: 'Testbird 7', satelliteLongitudeDeg: '19.2', downlinkFrequencyGHz: '11.7',
    polarization: 'linear-horizontal', eirpDbw: '51', symbolRateMsps: '27.5', modcod: 'QPSK 3/4', lnbNoiseTempK: '60', antennaNoiseTempK: '40',
  }));
  const climate = await createClimateProfile(companyId, climateProfileSchema.parse({ kind: 'known-r001', name: `Test R0.01 ${rand()}`, sourceNote: 'Invented for a test', data: { r001MmH: 42 } }));
  const dishes = await Promise.all(
    [0.6, 0.8].map((d) => createDish(companyId, { name: `Test dish ${d} m ${rand()}`, diameterM: d, efficiency: 0.65, hardwarePrice: '100.00', labourPrice: '50.00', mountNotes: null, active: true })),
  );
  // Every study of a company here types in the same invented customer: ticked as a different customer
  // with the same name each time, so only the plan limit refuses (the name rule: customer-duplicates.test.ts).
  return newStudySchema.parse({
    customerMode: 'new', newCustomerName: `Test Customer ${rand()}`, sameNameOk: 'on', siteName: 'Test roof', latDeg: '48.1', lonDeg: '11.5', altitudeM: '500',
    serviceProfileId: String(service.id), climateProfileId: String(climate.id), dishIds: dishes.map((d) => String(d.id)), targetAvailabilityPercent: '99.7',
  });
}

describe('studies per month', () => {
  it('the study service refuses the study over the limit, naming the limit and how to raise it', async () => {
    const plan = await createTestPlan({ studies: 2 });
    const company = await createBillingCompany({ planId: plan.id });
    const user = await createUserWithRole(company.id, 'installer');
    const input = await studyInputsFor(company.id);
    await createStudy({ companyId: company.id, userId: user.id }, input);
    await createStudy({ companyId: company.id, userId: user.id }, input);
    const error = await refusal(() => createStudy({ companyId: company.id, userId: user.id }, input));
    expect(error.limit).toBe('studiesPerMonth');
    expect(error.code).toBe('plan_limit');
    expect(error.status).toBe(403);
    expect(error.message).toMatch(/allows 2 studies a month and 2 have been run this month/);
    expect(error.message).toMatch(/larger plan in Settings → Billing/);
    // The refused study left nothing behind (its new customer was in the same transaction).
    const { Study, Customer } = models();
    expect(await Study.count({ where: { companyId: company.id } })).toBe(2);
    expect(await Customer.count({ where: { companyId: company.id } })).toBe(2);
  });

  // Needs the limit check before the study's first insert: an insert that references the company
  // share-locks its row, and two such transactions then deadlock upgrading to FOR UPDATE.
  it('parallel study creation at the limit cannot overshoot it, and every refusal names the limit', async () => {
    const plan = await createTestPlan({ studies: 3 });
    const company = await createBillingCompany({ planId: plan.id });
    const user = await createUserWithRole(company.id, 'installer');
    const input = await studyInputsFor(company.id);
    const settled = await Promise.allSettled(Array.from({ length: 8 }, () => createStudy({ companyId: company.id, userId: user.id }, input)));
    for (const s of settled) if (s.status === 'rejected') expect(s.reason, String(s.reason)).toBeInstanceOf(PlanLimitError);
    expect(settled.filter((s) => s.status === 'fulfilled')).toHaveLength(3);
    expect(await models().Study.count({ where: { companyId: company.id } })).toBe(3);
  });

  it('studies made before this calendar month (UTC) do not count', async () => {
    const plan = await createTestPlan({ studies: 1 });
    const company = await createBillingCompany({ planId: plan.id });
    const user = await createUserWithRole(company.id, 'installer');
    const input = await studyInputsFor(company.id);
    const { id } = await createStudy({ companyId: company.id, userId: user.id }, input);
    await expect(check(company.id, 'studiesPerMonth')).rejects.toBeInstanceOf(PlanLimitError);
    const lastMonth = new Date(Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), 1) - 3600_000);
    await models().sequelize.query('UPDATE studies SET created_at = ? WHERE id = ?', { replacements: [lastMonth, id] });
    await expect(check(company.id, 'studiesPerMonth')).resolves.toBeUndefined();
  });
});

describe('uploads, active links, API access, quote branding', () => {
  it('uploads per month count this month\'s uploads', async () => {
    const plan = await createTestPlan({ uploads: 1 });
    const company = await createBillingCompany({ planId: plan.id });
    await expect(check(company.id, 'uploadsPerMonth')).resolves.toBeUndefined();
    await models().Upload.create({ companyId: company.id, kind: 'rain-curve', originalFilename: 'curve.csv', originalBytes: Buffer.from('p,r\n'), sizeBytes: 4, parseReport: {}, createdByUserId: null });
    const error = await refusal(() => check(company.id, 'uploadsPerMonth'));
    expect(error.limit).toBe('uploadsPerMonth');
    expect(error.message).toMatch(/allows 1 upload a month and 1 have been made this month/);
  });

  it('active links count links that are neither revoked nor expired', async () => {
    const plan = await createTestPlan({ links: 2 });
    const company = await createBillingCompany({ planId: plan.id });
    const { sequelize } = models();
    await sequelize.query(
      `INSERT INTO quotes (company_id, number, title, customer_name, site_name, service_name, chosen_option_index, chosen_option, options, study_snapshot, valid_until, created_at, updated_at)
       VALUES (?, 1, 'Test quote', 'Test Customer', 'Test roof', 'Test service', 0, '{}', '[]', '{}', '2099-01-01', NOW(), NOW())`,
      { replacements: [company.id] },
    );
    const [[quote]] = (await sequelize.query('SELECT id FROM quotes WHERE company_id = ?', { replacements: [company.id] })) as [{ id: number }[], unknown];
    const link = (expires: string, revoked: string | null) =>
      sequelize.query('INSERT INTO share_links (company_id, quote_id, token_hash, expires_at, revoked_at, created_at, updated_at) VALUES (?, ?, ?, ?, ?, NOW(), NOW())', {
        replacements: [company.id, quote.id, rand().padEnd(64, '0'), expires, revoked],
      });
    await link('2099-01-01', null);
    await link('2000-01-01', null); // expired
    await link('2099-01-01', '2020-01-01'); // revoked
    expect((await getPlanUsage(company.id)).activeLinks).toBe(1);
    await expect(check(company.id, 'activeLinks')).resolves.toBeUndefined();
    await link('2099-01-01', null);
    const error = await refusal(() => check(company.id, 'activeLinks'));
    expect(error.limit).toBe('activeLinks');
    expect(error.message).toMatch(/allows 2 active comparison links and 2 are active/);
  });

  it('API access and quote branding are on or off per plan', async () => {
    const without = await createBillingCompany({ planId: (await createTestPlan({ apiAccess: false })).id });
    const withApi = await createBillingCompany({ planId: (await createTestPlan({ apiAccess: true })).id });
    const error = await refusal(() => check(without.id, 'apiAccess'));
    expect(error.limit).toBe('apiAccess');
    expect(error.message).toMatch(/trade-off API is not part of the .* plan/);
    await expect(check(withApi.id, 'apiAccess')).resolves.toBeUndefined();
    const bench = await createBillingCompany({ planCode: 'bench' });
    expect((await refusal(() => check(bench.id, 'quoteBranding'))).limit).toBe('quoteBranding');
  });
});

describe('trial expiry and past-due grace fall back to the free tier (nothing deleted)', () => {
  it('a running trial has the trial plan\'s limits; an expired one has the free tier\'s', async () => {
    const trialId = await planIdByCode('trial');
    const running = await createBillingCompany({ planId: trialId, trialEndsAt: new Date(Date.now() + 86_400_000) });
    expect(await getPlanLimits(running.id)).toMatchObject({ planCode: 'trial', seats: 5, basis: { kind: 'trial' } });

    const expired = await createBillingCompany({ planId: trialId, trialEndsAt: new Date(Date.now() - 86_400_000) });
    await createUserWithRole(expired.id, 'admin');
    await createUserWithRole(expired.id, 'installer');
    const limits = await getPlanLimits(expired.id);
    expect(limits).toMatchObject({ planCode: 'bench', seats: 1, companyPlan: { code: 'trial' }, basis: { kind: 'trial_ended' } });
    const error = await refusal(() => check(expired.id, 'seats'));
    expect(error.message).toMatch(/field trial ended on \d{4}-\d{2}-\d{2}, so the Bench limits apply/);
    // Over the free tier's seats, but nobody was removed.
    expect(await models().Membership.count({ where: { companyId: expired.id } })).toBe(2);
  });

  it('a failed payment keeps the paid limits during the grace period, then the free tier applies', async () => {
    const plan = await createTestPlan({ seats: 5, studies: 300 });
    const company = await createBillingCompany({ planCode: 'bench' });
    const subId = `sub_${rand()}`;
    const t0 = Math.floor(Date.now() / 1000) - 60;
    const send = (status: string, created: number) =>
      webhook(webhookRequest(eventOf('customer.subscription.updated', subscriptionObject({ id: subId, customer: company.customerId!, status, plan }), created)));
    expect((await send('active', t0)).status).toBe(200);
    expect(await getPlanLimits(company.id)).toMatchObject({ planId: plan.id, seats: 5, basis: { kind: 'plan' } });

    expect((await send('past_due', t0 + 10)).status).toBe(200);
    const during = await getPlanLimits(company.id);
    expect(during).toMatchObject({ planId: plan.id, seats: 5, basis: { kind: 'past_due_grace' } });
    const graceEndsAt = (during.basis as { graceEndsAt: Date }).graceEndsAt;
    expect(graceEndsAt.getTime()).toBe((t0 + 10) * 1000 + 7 * 86_400_000);

    const after = await getPlanLimits(company.id, undefined, { now: new Date(graceEndsAt.getTime() + 1000) });
    expect(after).toMatchObject({ planCode: 'bench', seats: 1, studiesPerMonth: 10, companyPlan: { id: plan.id }, basis: { kind: 'past_due_expired' } });

    // Enforcement reads the clock: move the grace end into the past and the free tier is enforced.
    await models().Subscription.update({ graceEndsAt: new Date(Date.now() - 1000) }, { where: { providerSubscriptionId: subId } });
    await createUserWithRole(company.id, 'admin');
    const error = await refusal(() => check(company.id, 'seats'));
    expect(error.message).toMatch(/payment is overdue .* so the Bench limits apply: an admin can pay the open invoice/);

    // Paid again: the paid limits return at once.
    expect((await send('active', t0 + 20)).status).toBe(200);
    expect(await getPlanLimits(company.id)).toMatchObject({ planId: plan.id, basis: { kind: 'plan' } });
    await expect(check(company.id, 'seats')).resolves.toBeUndefined();
  });
});
