import 'server-only';
import type { Transaction } from 'sequelize';
import {
  countOtherLiveSubscriptions,
  findPlanForProviderPrice,
  findSubscriptionByProviderId,
  getCompanyBilling,
  getFreeTierPlan,
  getPlanById,
  insertSubscription,
  setCompanyPlan,
  updateSubscription,
  type SubscriptionValues,
} from '@/db/queries/billing';
import { ENDED_STATUSES, LIVE_STATUSES, OVERDUE_STATUSES, graceEndFrom } from './policy';
import { reshapeSubscription, type ProviderSubscription } from './provider-objects';
import { resolveCompany } from './resolve-company';
import { getStripe } from './stripe';
import { recordAudit } from '@/server/audit/record';

/** Changes the provider reports have no person behind them. */
const PROVIDER = (companyId: number) => ({ companyId, actor: null, actorLabel: 'Payment provider' });

export type ApplyOutcome = 'applied' | 'stale' | 'unmatched_company' | 'unknown_plan' | 'unmatched_subscription';

const isIn = (list: readonly string[], value: string) => list.includes(value);

/**
 * Applies a subscription as the provider reported it at `observedAt` (the event's `created`, unix
 * seconds), inside the webhook's transaction.
 *
 * Out-of-order delivery: an event older than the newest one applied to this subscription is
 * stale and changes nothing; a canceled subscription never comes back (the provider's statuses
 * `canceled` and `incomplete_expired` are terminal). Two events within the same second cannot be
 * ordered by `created`, so on a tie the subscription is fetched from the provider and its current
 * state applied instead of either payload.
 */
export async function applySubscription(
  reported: ProviderSubscription,
  observedAt: number,
  t: Transaction,
  opts: { fetched?: boolean; companyId?: number } = {},
): Promise<ApplyOutcome> {
  let sub = reported;
  const resolved = await resolveCompany(sub.customerId, { metadata: sub.metadata, companyId: opts.companyId }, t);
  if (!resolved) return 'unmatched_company';
  // The company row is the lock every limit check takes: a plan change and a limit check for the
  // same company never interleave.
  const company = (await getCompanyBilling(resolved.id, t, true))!;
  const row = await findSubscriptionByProviderId(sub.id, t, true);

  if (row) {
    if (observedAt < row.lastEventCreated) return 'stale';
    if (isIn(ENDED_STATUSES, row.status) && !isIn(ENDED_STATUSES, sub.status)) return 'stale';
    if (observedAt === row.lastEventCreated && !opts.fetched) {
      sub = reshapeSubscription(await getStripe().subscriptions.retrieve(sub.id));
    }
  }

  const plan =
    (await findPlanForProviderPrice(sub.productId, sub.priceId, t)) ??
    (row?.planId ? null : await planFromMetadata(sub.metadata, t));
  const overdue = isIn(OVERDUE_STATUSES, sub.status);
  const pastDueSince = overdue ? (row?.pastDueSince ?? new Date(observedAt * 1000)) : null;
  const ended = isIn(ENDED_STATUSES, sub.status);
  const planId = plan?.id ?? row?.planId ?? null;

  const values: SubscriptionValues = {
    companyId: company.id,
    planId,
    providerSubscriptionId: sub.id,
    providerCustomerId: sub.customerId,
    providerPriceId: sub.priceId,
    status: sub.status,
    currentPeriodEnd: sub.currentPeriodEnd,
    cancelAtPeriodEnd: ended ? false : sub.cancelAtPeriodEnd,
    canceledAt: sub.canceledAt,
    endedAt: sub.endedAt,
    pastDueSince,
    graceEndsAt: pastDueSince ? graceEndFrom(pastDueSince) : null,
    // A requested change is settled once the provider reports that plan (or the subscription ends).
    pendingPlanId: ended || (row?.pendingPlanId != null && row.pendingPlanId === plan?.id) ? null : (row?.pendingPlanId ?? null),
    lastEventCreated: Math.max(observedAt, row?.lastEventCreated ?? 0),
  };
  const saved = row ? (await updateSubscription(row.id, values, t), row.id) : (await insertSubscription(values, t)).id;
  if (!row || row.status !== sub.status) {
    await recordAudit(PROVIDER(company.id), { action: 'billing.subscription_status', target: null, detail: { subscriptionId: sub.id, from: row?.status ?? null, to: sub.status } }, t);
  }

  const planChanged = async (to: { id: number; name: string }) => {
    await setCompanyPlan(company.id, to.id, t);
    await recordAudit(PROVIDER(company.id), { action: 'billing.plan_changed', target: to.name, detail: { planId: to.id, fromPlanId: company.planId, subscriptionId: sub.id } }, t);
  };
  if (isIn(LIVE_STATUSES, sub.status)) {
    if (planId != null && company.planId !== planId) await planChanged(plan ?? (await getPlanById(planId, t))!);
  } else if (ended) {
    // Back to the free tier, unless another live subscription (a second checkout) still governs.
    const others = await countOtherLiveSubscriptions(company.id, saved, t);
    if (others === 0) {
      const free = await getFreeTierPlan(t);
      if (free && company.planId !== free.id) await planChanged(free);
    }
  }
  return plan || row?.planId ? 'applied' : 'unknown_plan';
}

async function planFromMetadata(metadata: Record<string, string>, t: Transaction) {
  const id = metadata.fadeledger_plan_id;
  if (!id || !/^\d{1,10}$/.test(id)) return null;
  const plan = await getPlanById(Number(id), t);
  return plan?.kind === 'paid' ? plan : null;
}
