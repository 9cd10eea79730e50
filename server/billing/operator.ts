import 'server-only';
import { models } from '@/db/models';
import { findLiveSubscription, getCompanyBilling, getPlanById, setCompanyPlan } from '@/db/queries/billing';
import { setCompanyTrialEnd } from '@/db/queries/staff-accounts';
import { ConflictError, NotFoundError } from '@/server/errors';
import { recordAudit } from '@/server/audit/record';
import type { Actor } from '@/server/auth/audit';
import { moveSubscriptionAtProvider } from './checkout';

/** The platform operator acting on a company's account (staff pages); every step names a reason. */
export type OperatorActor = { user: NonNullable<Actor> };

const DAY_MS = 86_400_000;

/**
 * Extends a company's trial by `days` from its current end (or from now, if it has already
 * ended), under the company row lock, with the audit row in the same transaction. Only a company
 * on a trial plan has a trial to extend; the row is written for that company, so its admins see
 * it in their own log.
 */
export async function extendTrial(actor: OperatorActor, companyId: number, days: number, reason: string, now: Date = new Date()): Promise<{ companyName: string; trialEndsAt: Date }> {
  return models().sequelize.transaction(async (t) => {
    const company = await getCompanyBilling(companyId, t, true);
    if (!company) throw new NotFoundError('That company');
    const plan = await getPlanById(company.planId, t);
    if (plan?.kind !== 'trial') throw new ConflictError(`${company.name} is on ${plan?.name ?? 'another plan'}, not a trial: change its plan instead.`);
    const from = company.trialEndsAt && company.trialEndsAt.getTime() > now.getTime() ? company.trialEndsAt : now;
    const trialEndsAt = new Date(from.getTime() + days * DAY_MS);
    await setCompanyTrialEnd(companyId, trialEndsAt, t);
    await recordAudit(
      { companyId, actor: actor.user },
      { action: 'staff.trial_extended', target: company.name, detail: { days, reason, previousTrialEndsAt: company.trialEndsAt?.toISOString() ?? null, trialEndsAt: trialEndsAt.toISOString() } },
      t,
    );
    return { companyName: company.name, trialEndsAt };
  });
}

export type OperatorPlanChange = { companyName: string; planName: string; via: 'provider' | 'assigned' };

/**
 * Moves a company to another plan, with a reason.
 *
 * A company paying through the provider keeps its subscription as the source of truth: the change
 * goes to the provider exactly as an admin's would (prorated, pending until the provider confirms;
 * writing our plan column directly would be undone by the next subscription event, and the
 * customer would be billed for one plan while holding another). Only paid plans can be reached
 * that way; moving a paying company to a free or trial plan means cancelling at the provider,
 * which we leave to the provider's dashboard and say so.
 *
 * A company without a live subscription (trial, free tier, a plan staff arranged) is assigned the
 * plan directly, under the company row lock, with the audit row in the same transaction; a trial
 * plan starts a fresh trial of that plan's length.
 */
export async function changeAccountPlan(actor: OperatorActor, companyId: number, planId: number, reason: string, now: Date = new Date()): Promise<OperatorPlanChange> {
  const [company, plan] = await Promise.all([getCompanyBilling(companyId), getPlanById(planId)]);
  if (!company) throw new NotFoundError('That company');
  if (!plan) throw new NotFoundError('That plan');
  const live = await findLiveSubscription(companyId);
  if (live) {
    if (plan.kind !== 'paid') {
      throw new ConflictError(`${company.name} pays through the payment provider. Cancel its subscription there to move it off a paid plan (it falls back to the free tier when the subscription ends).`);
    }
    if ((live.pendingPlanId ?? live.planId) === plan.id) throw new ConflictError(`${company.name} is already on ${plan.name} (or moving to it).`);
    await moveSubscriptionAtProvider(companyId, live, plan, async (t) => {
      await recordAudit(
        { companyId, actor: actor.user },
        { action: 'staff.plan_change_requested', target: plan.name, detail: { planId: plan.id, fromPlanId: live.planId, subscriptionId: live.providerSubscriptionId, reason } },
        t,
      );
    });
    return { companyName: company.name, planName: plan.name, via: 'provider' };
  }
  await models().sequelize.transaction(async (t) => {
    const locked = await getCompanyBilling(companyId, t, true);
    if (!locked) throw new NotFoundError('That company');
    // A checkout may have completed while we read: the provider's subscription wins then.
    if (await findLiveSubscription(companyId, t)) throw new ConflictError(`${company.name} has just started a subscription: reload the page.`);
    if (locked.planId === plan.id) throw new ConflictError(`${company.name} is already on ${plan.name}.`);
    const fromPlan = await getPlanById(locked.planId, t);
    await setCompanyPlan(companyId, plan.id, t);
    const trialEndsAt = plan.kind === 'trial' ? new Date(now.getTime() + (plan.trialDays ?? 14) * DAY_MS) : locked.trialEndsAt;
    if (plan.kind === 'trial') await setCompanyTrialEnd(companyId, trialEndsAt, t);
    await recordAudit(
      { companyId, actor: actor.user },
      {
        action: 'staff.plan_changed',
        target: plan.name,
        detail: { planId: plan.id, fromPlanId: locked.planId, fromPlan: fromPlan?.name ?? null, reason, ...(plan.kind === 'trial' && trialEndsAt ? { trialEndsAt: trialEndsAt.toISOString() } : {}) },
      },
      t,
    );
  });
  return { companyName: company.name, planName: plan.name, via: 'assigned' };
}
