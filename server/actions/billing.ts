'use server';

import { z } from 'zod';
import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { safeAction } from './safe-action';
import { changePlan, openBillingPortal, startCheckout } from '@/server/billing/checkout';

const BILLING_PAGE = '/settings/billing';

const planChoiceSchema = z.object({
  planId: z.coerce.number({ error: 'Choose a plan.' }).int('Choose a plan.').positive('Choose a plan.'),
});
const noInput = z.object({});

/** Opens the provider's hosted checkout for a paid plan (admins only). */
export const startCheckoutAction = safeAction({ schema: planChoiceSchema, permission: 'billing.manage' }, async (input, ctx) => {
  const { url } = await startCheckout({ companyId: ctx.companyId, userId: ctx.user.id, email: ctx.user.email, name: ctx.user.name }, input.planId);
  redirect(url);
});

/** Moves the live subscription to another paid plan; it applies when the provider confirms. */
export const changePlanAction = safeAction({ schema: planChoiceSchema, permission: 'billing.manage' }, async (input, ctx) => {
  const { planName } = await changePlan({ companyId: ctx.companyId, userId: ctx.user.id, email: ctx.user.email, name: ctx.user.name }, input.planId);
  revalidatePath(BILLING_PAGE);
  return { message: `Change to ${planName} sent to the payment provider. It applies as soon as the provider confirms it.` };
});

/** The provider's billing portal: card, invoices, plan change and cancellation. */
export const openPortalAction = safeAction({ schema: noInput, permission: 'billing.manage' }, async (_input, ctx) => {
  const url = await openBillingPortal({ companyId: ctx.companyId, userId: ctx.user.id, email: ctx.user.email, name: ctx.user.name });
  redirect(url);
});
