import 'server-only';
import type { Transaction } from 'sequelize';
import { assertWithinLimit } from '@/server/billing/limits';

/**
 * The plan limits of studies, uploads and the trade-off API, checked through the one limits
 * function (server/billing/limits.ts), which locks the company row inside our transaction so a
 * burst of requests at the limit cannot overshoot it.
 */
export async function assertStudyWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await assertWithinLimit(companyId, 'studiesPerMonth', t);
}

export async function assertUploadWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await assertWithinLimit(companyId, 'uploadsPerMonth', t);
}

export async function assertApiWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await assertWithinLimit(companyId, 'apiAccess', t);
}
