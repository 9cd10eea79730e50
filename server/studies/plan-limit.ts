import 'server-only';
import type { Transaction } from 'sequelize';
import { assertWithinLimit } from '@/server/billing/limits';

type LimitCheck = (companyId: number, limit: string, t: Transaction, opts?: { adding?: number }) => Promise<void>;

/**
 * Plan limits of this part, checked through the one limits function (server/billing/limits.ts,
 * which locks the company row inside our transaction). Billing owns which limit names it knows;
 * we name ours here so there is one place to look.
 */
export async function assertStudyWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await (assertWithinLimit as LimitCheck)(companyId, 'studiesPerMonth', t);
}

export async function assertUploadWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await (assertWithinLimit as LimitCheck)(companyId, 'uploadsPerMonth', t);
}

export async function assertApiWithinPlan(companyId: number, t: Transaction): Promise<void> {
  await (assertWithinLimit as LimitCheck)(companyId, 'apiAccess', t);
}
