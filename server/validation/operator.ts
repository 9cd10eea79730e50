import { z } from 'zod';

const id = (what: string) => z.coerce.number({ error: `Choose ${what}.` }).int(`Choose ${what}.`).positive(`Choose ${what}.`);

// Support needs to know later why an account was changed: a few words at least.
const reason = z
  .string({ error: 'Say why (it goes into the audit log).' })
  .trim()
  .min(5, 'Say why in a few words (at least 5 characters); it goes into the audit log.')
  .max(500, 'Keep the reason under 500 characters.');

/** Staff: extend a company's trial. 1–90 days at a time (a product decision, no source). */
export const extendTrialSchema = z.object({
  companyId: id('a company'),
  days: z.coerce.number({ error: 'Give a number of days.' }).int('Whole days only.').min(1, 'At least 1 day.').max(90, 'At most 90 days at a time.'),
  reason,
});

/** Staff: move a company to another plan. */
export const changeAccountPlanSchema = z.object({
  companyId: id('a company'),
  planId: id('a plan'),
  reason,
});
