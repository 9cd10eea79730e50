'use server';

import { z } from 'zod';
import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { createPlan, resyncPlan, updatePlan, type PlanSaveResult } from '@/server/billing/plan-catalogue';
import { editPlanSchema, newPlanSchema } from '@/server/billing/plan-schema';

// Staff only: the plan catalogue and its sync to the payment provider.
const PLANS_PAGE = '/plans';

function saved(what: string, result: PlanSaveResult): { data: { planId: number }; message: string } {
  revalidatePath(PLANS_PAGE);
  revalidatePath('/pricing');
  if (result.syncError) return { data: { planId: result.planId }, message: `${what} saved, but the payment provider was not updated: ${result.syncError} Use “Sync to provider” to retry.` };
  const sync = result.sync;
  const detail = !sync?.productId
    ? 'Nothing to sell, so nothing was sent to the payment provider.'
    : sync.createdPrice
      ? `Synced: a new monthly price was created at the provider${sync.archivedPriceId ? ' and the old one archived (current subscribers keep it until they change plan)' : ''}.`
      : 'Synced: product updated, price unchanged.';
  return { data: { planId: result.planId }, message: `${what} saved. ${detail}` };
}

export const createPlanAction = safeAction({ schema: newPlanSchema, permission: 'plans.manage' }, async (input) => saved(`Plan ${input.name}`, await createPlan(input)));

export const updatePlanAction = safeAction({ schema: editPlanSchema, permission: 'plans.manage' }, async (input) => saved(`Plan ${input.name}`, await updatePlan(input)));

export const syncPlanAction = safeAction({ schema: z.object({ id: z.coerce.number().int().positive() }), permission: 'plans.manage' }, async (input) =>
  saved('Plan', await resyncPlan(input.id)),
);
