import { z } from 'zod';

/** Largest allowance a plan may set; big enough for any fleet, small enough to stay an INT. */
export const LIMIT_MAX = 1_000_000;

const count = (label: string, min = 0) =>
  z.coerce
    .number({ error: `${label} must be a whole number.` })
    .int(`${label} must be a whole number.`)
    .min(min, `${label} must be at least ${min}.`)
    .max(LIMIT_MAX, `${label} must be at most ${LIMIT_MAX.toLocaleString('en-US')}.`);

const checkbox = z.preprocess((v) => v === true || v === 'on' || v === 'true' || v === '1', z.boolean());

/**
 * A plan as the staff form posts it; the same schema runs in the action. `code` and `kind` are
 * fixed once the plan exists (sign-up and the free-tier fallback find plans by them).
 */
export const planFieldsSchema = z
  .object({
    name: z.string().trim().min(2, 'Name needs at least 2 characters.').max(80, 'Name is at most 80 characters.'),
    description: z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), z.string().trim().max(500, 'Description is at most 500 characters.').nullable().default(null)),
    monthlyPriceUsd: z.preprocess(
      (v) => (typeof v === 'string' ? v.trim().replace(/^\$/, '').replace(/,/g, '') : v),
      z.string().regex(/^\d{1,7}(\.\d{1,2})?$/, 'Monthly price must be an amount like 49.00 (US dollars, at most 2 decimals).'),
    ).transform((v) => (Number(v).toFixed(2))),
    seatLimit: count('Seats', 1),
    studiesPerMonth: count('Studies per month'),
    activeLinksLimit: count('Active comparison links'),
    uploadsPerMonth: count('Uploads per month'),
    // Per campaign, not per month: the upload stops at the first row over it (receive-campaign.ts).
    campaignSitesLimit: count('Sites per campaign'),
    apiAccess: checkbox,
    quoteBranding: checkbox,
    isPublic: checkbox,
    sortOrder: count('Display order'),
    trialDays: z.preprocess((v) => (v === '' || v === undefined || v === null ? null : v), z.coerce.number().int('Trial days must be a whole number.').min(1, 'Trial days must be at least 1.').max(90, 'Trial days must be at most 90.').nullable()),
  });

export const newPlanSchema = planFieldsSchema
  .extend({
    code: z.string().trim().toLowerCase().regex(/^[a-z][a-z0-9-]{1,38}$/, 'Code: 2–39 lower-case letters, digits or dashes, starting with a letter.'),
    kind: z.enum(['paid', 'free', 'trial'], { error: 'Choose paid, free or trial.' }),
  })
  .superRefine(checkKindAndPrice);

export const editPlanSchema = planFieldsSchema.extend({ id: z.coerce.number().int().positive() });

export type NewPlanInput = z.infer<typeof newPlanSchema>;
export type EditPlanInput = z.infer<typeof editPlanSchema>;

/** Paid plans cost something; free and trial plans cost nothing; only a trial has trial days. */
export function kindAndPriceProblems(kind: 'paid' | 'free' | 'trial', monthlyPriceUsd: string, trialDays: number | null): Record<string, string> {
  const problems: Record<string, string> = {};
  const price = Number(monthlyPriceUsd);
  if (kind === 'paid' && !(price > 0)) problems.monthlyPriceUsd = 'A paid plan needs a monthly price above 0.';
  if (kind !== 'paid' && price !== 0) problems.monthlyPriceUsd = 'Free and trial plans cost 0.00.';
  if (kind === 'trial' && trialDays === null) problems.trialDays = 'A trial plan needs its number of days.';
  if (kind !== 'trial' && trialDays !== null) problems.trialDays = 'Only a trial plan has trial days.';
  return problems;
}

function checkKindAndPrice(v: { kind: 'paid' | 'free' | 'trial'; monthlyPriceUsd: string; trialDays: number | null }, ctx: z.RefinementCtx): void {
  for (const [path, message] of Object.entries(kindAndPriceProblems(v.kind, v.monthlyPriceUsd, v.trialDays))) {
    ctx.addIssue({ code: 'custom', path: [path], message });
  }
}
