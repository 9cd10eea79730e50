import 'server-only';
import type { CompanyLock } from '@/db/queries/company-lock';
import { assertWithinLimit, type LimitName } from '@/server/billing/limits';

/**
 * The plan-limit check for everything outside billing: it takes the company lock
 * (lockCompanyRow), so the check and the insert that follows are one step for every other
 * request of the company and a burst at the limit cannot overshoot it. Throws PlanLimitError
 * naming the limit and how to raise it when `adding` more would go over.
 *
 * @example
 *   await sequelize.transaction(async (t) => {
 *     await assertWithinPlan(await lockCompanyRow(companyId, t), 'studiesPerMonth');
 *     await insertStudy(companyId, …, t);
 *   });
 */
export async function assertWithinPlan(lock: CompanyLock, limit: LimitName, opts: { adding?: number } = {}): Promise<void> {
  await assertWithinLimit(lock.companyId, limit, lock.transaction, opts);
}
