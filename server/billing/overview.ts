import 'server-only';
import type { SubscriptionStatus } from '@/db/models';
import { findLiveSubscription, getCompanyBilling, getPlanById } from '@/db/queries/billing';
import { NotFoundError } from '@/server/errors';
import { getPlanLimits, getPlanUsage, type PlanLimits, type PlanUsage } from './limits';

export type SubscriptionSummary = {
  status: SubscriptionStatus;
  planName: string | null;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  graceEndsAt: Date | null;
  lastPaymentFailedAt: Date | null;
  pendingPlan: { id: number; name: string } | null;
};

export type BillingOverview = {
  limits: PlanLimits;
  usage: PlanUsage;
  trialEndsAt: Date | null;
  subscription: SubscriptionSummary | null;
  /** The company has a customer at the provider, so the portal can open. */
  hasBillingAccount: boolean;
};

/** Everything the billing page shows for one company, read in one place. */
export async function getBillingOverview(companyId: number): Promise<BillingOverview> {
  const company = await getCompanyBilling(companyId);
  if (!company) throw new NotFoundError('That company');
  const [limits, usage, live] = await Promise.all([getPlanLimits(companyId), getPlanUsage(companyId), findLiveSubscription(companyId)]);
  let subscription: SubscriptionSummary | null = null;
  if (live) {
    const [plan, pending] = await Promise.all([
      live.planId ? getPlanById(live.planId) : null,
      live.pendingPlanId ? getPlanById(live.pendingPlanId) : null,
    ]);
    subscription = {
      status: live.status,
      planName: plan?.name ?? null,
      currentPeriodEnd: live.currentPeriodEnd,
      cancelAtPeriodEnd: live.cancelAtPeriodEnd,
      graceEndsAt: live.graceEndsAt,
      lastPaymentFailedAt: live.lastPaymentFailedAt ?? null,
      pendingPlan: pending ? { id: pending.id, name: pending.name } : null,
    };
  }
  return { limits, usage, trialEndsAt: company.trialEndsAt, subscription, hasBillingAccount: Boolean(company.stripeCustomerId) };
}

export type BillingNotice =
  | { kind: 'past_due_grace'; graceEndsAt: Date }
  | { kind: 'past_due_expired'; freePlanName: string; paidPlanName: string }
  | { kind: 'trial_ending'; endsAt: Date; daysLeft: number }
  | { kind: 'trial_ended'; freePlanName: string }
  | { kind: 'paused'; freePlanName: string };

/** Days before the end of a trial from which the banner reminds the team. */
export const TRIAL_REMINDER_DAYS = 3;

/** What the app-wide banner should say for this company now, or null for nothing. */
export async function getBillingNotice(companyId: number, now = new Date()): Promise<BillingNotice | null> {
  const limits = await getPlanLimits(companyId, undefined, { now });
  const b = limits.basis;
  switch (b.kind) {
    case 'past_due_grace':
      return { kind: 'past_due_grace', graceEndsAt: b.graceEndsAt };
    case 'past_due_expired':
      return { kind: 'past_due_expired', freePlanName: limits.planName, paidPlanName: limits.companyPlan.name };
    case 'trial_ended':
      return { kind: 'trial_ended', freePlanName: limits.planName };
    case 'paused':
      return { kind: 'paused', freePlanName: limits.planName };
    case 'trial': {
      if (!b.endsAt) return null;
      const daysLeft = Math.ceil((b.endsAt.getTime() - now.getTime()) / 86_400_000);
      return daysLeft <= TRIAL_REMINDER_DAYS ? { kind: 'trial_ending', endsAt: b.endsAt, daysLeft } : null;
    }
    default:
      return null;
  }
}
