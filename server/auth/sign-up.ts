import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { models } from '@/db/models';
import { InvalidInputError } from '@/server/errors';
import { createUser, findUserByEmail, normaliseEmail } from '@/db/queries/users';
import { createCompany, findPlanByCode } from '@/db/queries/companies';
import { addMembership } from '@/db/queries/team';
import { hashPassword } from './password';
import { claimAttempt, settleAttempt } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';

export const TRIAL_PLAN_CODE = 'trial';
export const EMAIL_TAKEN = 'An account already uses this address. Sign in instead, or reset its password.';

/**
 * A new company with the signer as its admin, on the trial plan (trial ends after the plan's
 * trial_days), in one transaction: either all three rows exist or none does.
 */
export async function signUpCompany(
  input: { name: string; companyName: string; email: string; password: string },
  meta: RequestMeta,
): Promise<{ userId: string; companyId: number }> {
  // Every attempt that passes the throttle counts, taken address or not (see THROTTLE_RULES).
  const attempt = await claimAttempt('sign_up', { email: normaliseEmail(input.email), ip: meta.ip });
  if (await findUserByEmail(input.email)) throw new InvalidInputError(EMAIL_TAKEN, { email: [EMAIL_TAKEN] });
  const passwordHash = await hashPassword(input.password);
  const { sequelize } = models();
  try {
    const result = await sequelize.transaction(async (t) => {
      const plan = await findPlanByCode(TRIAL_PLAN_CODE, t);
      if (!plan) throw new Error(`plan "${TRIAL_PLAN_CODE}" is missing from the plans table`);
      const days = plan.trialDays ?? 14;
      const company = await createCompany({ name: input.companyName, planId: plan.id, trialEndsAt: new Date(Date.now() + days * 86_400_000) }, t);
      const user = await createUser({ email: input.email, name: input.name, passwordHash }, t);
      await addMembership(company.id, user.id, 'admin', t);
      await audit(
        { companyId: company.id, actor: { id: user.id, name: user.name, email: user.email }, action: 'company.created', subjectUserId: user.id, target: company.name, detail: { plan: plan.code, trialDays: days } },
        meta,
        t,
      );
      return { userId: user.id, companyId: company.id };
    });
    await settleAttempt(attempt);
    return result;
  } catch (error) {
    // Two sign-ups with one address at once: the unique index decides, the loser hears why.
    if (error instanceof UniqueConstraintError) throw new InvalidInputError(EMAIL_TAKEN, { email: [EMAIL_TAKEN] });
    throw error;
  }
}
