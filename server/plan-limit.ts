import 'server-only';
import type { CompanyLock } from '@/db/queries/company-lock';
import { PlanLimitError } from '@/server/errors';
import { COUNTED, getPlanLimits, limitMessage, type LimitName } from '@/server/billing/limits';

/**
 * The one plan-limit check. It asks for the company lock token (lockCompanyRow), so it cannot be
 * called without the company row held FOR UPDATE in the caller's transaction: parallel requests of
 * one company queue at the lock and a burst at the limit cannot overshoot it. The plan and the
 * counts are read as locking reads, so a plan change a webhook committed a moment ago is seen.
 * Throws PlanLimitError naming the limit and how to raise it when `adding` more would go over.
 *
 * @example
 *   await sequelize.transaction(async (t) => {
 *     await assertWithinPlan(await lockCompanyRow(companyId, t), 'studiesPerMonth');
 *     await insertStudy(companyId, …, t);
 *   });
 */
export async function assertWithinPlan(lock: CompanyLock, limit: LimitName, opts: { adding?: number } = {}): Promise<void> {
  const { companyId, transaction: t } = lock;
  const limits = await getPlanLimits(companyId, t, { lockedRead: true });
  if (limit === 'apiAccess' || limit === 'quoteBranding') {
    if (!limits[limit]) throw new PlanLimitError(limit, limitMessage(limit, limits, 0));
    return;
  }
  const adding = opts.adding ?? 1;
  // Sites per campaign is a size, not a count over time: `adding` is the campaign's size.
  if (limit === 'campaignSites') {
    if (adding > limits.campaignSites) throw new PlanLimitError(limit, limitMessage(limit, limits, adding));
    return;
  }
  const used = await COUNTED[limit](companyId, t);
  if (used + adding > limits[limit]) throw new PlanLimitError(limit, limitMessage(limit, limits, used));
}
