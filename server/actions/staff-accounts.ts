'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { changeAccountPlanSchema, extendTrialSchema } from '@/server/validation/operator';
import { changeAccountPlan, extendTrial } from '@/server/billing/operator';
import { actorOf } from '@/server/audit/record';

// Staff only ('accounts.manage'): operator actions on a company's account, each audited with its reason.
const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

export const extendTrialAction = safeAction({ schema: extendTrialSchema, permission: 'accounts.manage' }, async (input, ctx) => {
  const { companyName, trialEndsAt } = await extendTrial({ user: actorOf(ctx) }, input.companyId, input.days, input.reason);
  revalidatePath(`/accounts/${input.companyId}`);
  revalidatePath('/accounts');
  return { data: { trialEndsAt: trialEndsAt.toISOString() }, message: `Trial of ${companyName} extended to ${dateFmt.format(trialEndsAt)} (UTC). The company’s admins see it in their audit log.` };
});

export const changeAccountPlanAction = safeAction({ schema: changeAccountPlanSchema, permission: 'accounts.manage' }, async (input, ctx) => {
  const done = await changeAccountPlan({ user: actorOf(ctx) }, input.companyId, input.planId, input.reason);
  revalidatePath(`/accounts/${input.companyId}`);
  revalidatePath('/accounts');
  return {
    data: { via: done.via },
    message:
      done.via === 'provider'
        ? `Change to ${done.planName} sent to the payment provider for ${done.companyName}; it applies (prorated) when the provider confirms.`
        : `${done.companyName} is now on ${done.planName}.`,
  };
});
