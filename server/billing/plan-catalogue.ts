import 'server-only';
import { models } from '@/db/models';
import { findPlanByCode, getPlanById, insertPlan, markPlanUnsynced, updatePlanFields } from '@/db/queries/billing';
import { AppError, ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';
import { kindAndPriceProblems, type EditPlanInput, type NewPlanInput } from './plan-schema';
import { syncPlanToProvider, type PlanSyncResult } from './plan-sync';

export type PlanSaveResult = { planId: number; sync: PlanSyncResult | null; syncError: string | null };

/**
 * Saves the plan in MariaDB first (the catalogue is ours), then pushes it to the payment provider.
 * A provider failure leaves the saved plan marked unsynced with the reason, for staff to retry.
 */
async function saveThenSync(planId: number): Promise<PlanSaveResult> {
  try {
    return { planId, sync: await syncPlanToProvider(planId), syncError: null };
  } catch (error) {
    if (error instanceof AppError && error.code === 'provider_error') return { planId, sync: null, syncError: error.message };
    throw error;
  }
}

export async function createPlan(input: NewPlanInput): Promise<PlanSaveResult> {
  const { sequelize } = models();
  const planId = await sequelize.transaction(async (t) => {
    if (await findPlanByCode(input.code, t)) throw new InvalidInputError(`A plan with code "${input.code}" exists already.`, { code: ['Already used.'] });
    const plan = await insertPlan({ ...input, description: input.description ?? null }, t);
    return plan.id;
  });
  return saveThenSync(planId);
}

export async function updatePlan(input: EditPlanInput): Promise<PlanSaveResult> {
  const { sequelize } = models();
  await sequelize.transaction(async (t) => {
    const plan = await getPlanById(input.id, t);
    if (!plan) throw new NotFoundError('That plan');
    const problems = kindAndPriceProblems(plan.kind, input.monthlyPriceUsd, input.trialDays);
    if (Object.keys(problems).length > 0) {
      throw new InvalidInputError('Please check the highlighted fields.', Object.fromEntries(Object.entries(problems).map(([k, v]) => [k, [v]])));
    }
    const { id: _id, ...fields } = input;
    await updatePlanFields(input.id, { ...fields, description: fields.description ?? null, kind: plan.kind }, t);
    await markPlanUnsynced(input.id, t);
  });
  return saveThenSync(input.id);
}

export async function resyncPlan(planId: number): Promise<PlanSaveResult> {
  const plan = await getPlanById(planId);
  if (!plan) throw new NotFoundError('That plan');
  const result = await saveThenSync(planId);
  if (result.syncError) throw new ConflictError(result.syncError);
  return result;
}
