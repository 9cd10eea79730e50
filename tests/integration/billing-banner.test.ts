import { afterAll, describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { BillingBanner } from '@/components/billing/billing-banner';
import { getBillingNotice } from '@/server/billing/overview';
import { createBillingCompany, createTestPlan, planIdByCode, rand } from './billing-fixtures';

/** The app-wide billing banner: what it says for each state, and to whom it offers the fix. */
afterAll(closeSequelize);

async function bannerHtml(companyId: number, canManage: boolean): Promise<string> {
  const element = await BillingBanner({ companyId, canManage });
  return element ? renderToStaticMarkup(element) : '';
}

async function withSubscription(status: string, graceEndsAt: Date | null) {
  const plan = await createTestPlan();
  const company = await createBillingCompany({ planId: plan.id });
  await models().Subscription.create({
    companyId: company.id, planId: plan.id, providerSubscriptionId: `sub_${rand()}`, providerCustomerId: company.customerId!, providerPriceId: plan.priceId,
    status: status as 'active', currentPeriodEnd: new Date(Date.now() + 20 * 86_400_000), cancelAtPeriodEnd: false, canceledAt: null, endedAt: null,
    pastDueSince: graceEndsAt ? new Date(graceEndsAt.getTime() - 7 * 86_400_000) : null, graceEndsAt,
  });
  return company;
}

describe('billing banner', () => {
  it('says nothing for a paid-up subscription or the free tier', async () => {
    expect(await bannerHtml((await withSubscription('active', null)).id, true)).toBe('');
    expect(await bannerHtml((await createBillingCompany({ planCode: 'bench' })).id, true)).toBe('');
  });

  it('past due in the grace period: names the date the free tier takes over; admins get the link', async () => {
    const company = await withSubscription('past_due', new Date(Date.UTC(2099, 0, 9)));
    const html = await bannerHtml(company.id, true);
    expect(html).toContain('The last payment failed');
    expect(html).toContain('9 Jan 2099');
    expect(html).toContain('href="/settings/billing"');
    const forInstaller = await bannerHtml(company.id, false);
    expect(forInstaller).not.toContain('href="/settings/billing"');
    expect(forInstaller).toContain('An admin of your company');
  });

  it('past due after the grace period: the free tier applies and nothing is deleted', async () => {
    const company = await withSubscription('past_due', new Date(Date.now() - 1000));
    expect(await bannerHtml(company.id, true)).toMatch(/A payment is overdue, so the Bench limits apply instead of Test plan/);
  });

  it('trial: reminds in the last days, then says the trial has ended', async () => {
    const trialId = await planIdByCode('trial');
    const soon = await createBillingCompany({ planId: trialId, trialEndsAt: new Date(Date.now() + 2 * 86_400_000 - 60_000) });
    expect(await getBillingNotice(soon.id)).toMatchObject({ kind: 'trial_ending', daysLeft: 2 });
    expect(await bannerHtml(soon.id, true)).toContain('in 2 days');
    const later = await createBillingCompany({ planId: trialId, trialEndsAt: new Date(Date.now() + 10 * 86_400_000) });
    expect(await bannerHtml(later.id, true)).toBe('');
    const ended = await createBillingCompany({ planId: trialId, trialEndsAt: new Date(Date.now() - 60_000) });
    expect(await bannerHtml(ended.id, true)).toContain('Your field trial has ended, so the Bench limits apply');
  });
});
