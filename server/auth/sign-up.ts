import 'server-only';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import { getEnv } from '@/server/env';
import { InvalidInputError } from '@/server/errors';
import { createUser, findUserByEmail, normaliseEmail } from '@/db/queries/users';
import { createCompany, findPlanByCode } from '@/db/queries/companies';
import { addMembership } from '@/db/queries/team';
import { deleteStaleSignupRequests, findSignupRequestByHash, markSignupRequestUsed, replaceSignupRequests } from '@/db/queries/signup-requests';
import { sendMail } from '@/server/mail/send';
import { signUpConfirmMail, signUpExistingAccountMail } from '@/server/mail/templates/sign-up';
import { hashPassword } from './password';
import { hashToken, newToken } from './tokens';
import { claimAttempt, settleAttempt } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';

export const TRIAL_PLAN_CODE = 'trial';
export const SIGN_UP_LINK_HOURS = 24;
/**
 * Both answers (new address or taken) take at least this long, so timing does not tell them
 * apart: both hash the password, and the floor covers the mail server's delay.
 */
export const SIGN_UP_RESPONSE_FLOOR_MS = 900;

export const signUpRequestedMessage = (email: string) => `Check your inbox at ${email} to finish creating your account.`;
export const SIGN_UP_LINK_DEAD = 'This sign-up link has expired or has already been used. Fill in the form again to get a new one.';
/** The address got an account after the link was sent; the inbox owner already knows that much. */
export const SIGN_UP_LINK_SUPERSEDED = 'This sign-up link is no longer valid. If you already finished creating your account, sign in; otherwise fill in the form again.';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const appUrl = () => getEnv().APP_URL.replace(/\/$/, '');

type SignUpInput = { name: string; companyName: string; email: string; password: string };

/**
 * The sign-up form: for a new address, a pending sign-up and a confirmation link; for a taken
 * one, a "you already have an account" mail. Nothing is created either way, and the answer is
 * the same. A mail server failure is logged, not shown: showing it for one case only would tell.
 */
export async function requestSignUp(input: SignUpInput, meta: RequestMeta): Promise<string> {
  const started = Date.now();
  const email = normaliseEmail(input.email);
  // Every attempt that passes the throttle counts, taken address or not (see THROTTLE_RULES).
  const attempt = await claimAttempt('sign_up', { email, ip: meta.ip });
  const passwordHash = await hashPassword(input.password);
  const existing = await findUserByEmail(email);
  if (existing) {
    await audit({ companyId: null, actor: null, action: 'sign_up.requested', subjectUserId: existing.id, target: existing.email, detail: { existingAccount: true } }, meta);
    try {
      await sendMail({ to: existing.email, ...signUpExistingAccountMail({ name: existing.name, signInUrl: `${appUrl()}/sign-in`, resetUrl: `${appUrl()}/forgot-password` }) });
    } catch (error) {
      console.error('sign-up (existing account) mail not sent:', (error as Error).message);
    }
  } else {
    const token = newToken();
    const expiresAt = new Date(Date.now() + SIGN_UP_LINK_HOURS * 3600_000);
    await deleteStaleSignupRequests();
    const { sequelize } = models();
    // The link exists only if its audit row does too.
    await sequelize.transaction(async (t) => {
      await replaceSignupRequests({ email, name: input.name, companyName: input.companyName, passwordHash, tokenHash: hashToken(token), expiresAt, requestedIp: meta.ip }, t);
      await audit({ companyId: null, actor: null, action: 'sign_up.requested', target: email, detail: { companyName: input.companyName } }, meta, t);
    });
    try {
      await sendMail({ to: email, ...signUpConfirmMail({ name: input.name, companyName: input.companyName, confirmUrl: `${appUrl()}/sign-up/confirm/${token}`, expiresAt }) });
    } catch (error) {
      console.error('sign-up confirmation mail not sent:', (error as Error).message);
    }
  }
  await settleAttempt(attempt);
  const left = SIGN_UP_RESPONSE_FLOOR_MS - (Date.now() - started);
  if (left > 0) await sleep(left);
  return signUpRequestedMessage(email);
}

export type SignUpLinkState = { state: 'valid'; email: string; name: string; companyName: string } | { state: 'dead'; message: string };

/** What the confirmation page shows before the button is pressed. */
export async function inspectSignUpLink(token: string): Promise<SignUpLinkState> {
  const row = await findSignupRequestByHash(hashToken(token));
  if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) return { state: 'dead', message: SIGN_UP_LINK_DEAD };
  if (await findUserByEmail(row.email)) return { state: 'dead', message: SIGN_UP_LINK_SUPERSEDED };
  return { state: 'valid', email: row.email, name: row.name, companyName: row.companyName };
}

/**
 * Spends the link and creates the company, its admin membership and the person in one
 * transaction with the link row locked FOR UPDATE: two openings at once queue, the second
 * finds the link used. The unique index on users.email settles a race with an invitation.
 */
export async function confirmSignUp(token: string, meta: RequestMeta): Promise<{ userId: string; companyId: number }> {
  const { sequelize } = models();
  try {
    return await sequelize.transaction(async (t) => {
      const row = await findSignupRequestByHash(hashToken(token), t, true);
      if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) throw new InvalidInputError(SIGN_UP_LINK_DEAD);
      if (await findUserByEmail(row.email, t)) {
        await markSignupRequestUsed(row.id, t);
        return { superseded: true as const };
      }
      await markSignupRequestUsed(row.id, t);
      const created = await createTrialCompany({ name: row.name, companyName: row.companyName, email: row.email, passwordHash: row.passwordHash }, meta, t);
      await audit({ companyId: created.companyId, actor: { id: created.userId, name: row.name, email: row.email }, action: 'sign_up.confirmed', subjectUserId: created.userId, target: row.email }, meta, t);
      return created;
    }).then((out) => {
      if ('superseded' in out) throw new InvalidInputError(SIGN_UP_LINK_SUPERSEDED);
      return out;
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new InvalidInputError(SIGN_UP_LINK_SUPERSEDED);
    throw error;
  }
}

/**
 * A new company with the signer as its admin, on the trial plan (trial ends after the plan's
 * trial_days), inside the caller's transaction: either all rows exist or none does.
 */
async function createTrialCompany(
  input: { name: string; companyName: string; email: string; passwordHash: string },
  meta: RequestMeta,
  t: Transaction,
): Promise<{ userId: string; companyId: number }> {
  const plan = await findPlanByCode(TRIAL_PLAN_CODE, t);
  if (!plan) throw new Error(`plan "${TRIAL_PLAN_CODE}" is missing from the plans table`);
  const days = plan.trialDays ?? 14;
  const company = await createCompany({ name: input.companyName, planId: plan.id, trialEndsAt: new Date(Date.now() + days * 86_400_000) }, t);
  const user = await createUser({ email: input.email, name: input.name, passwordHash: input.passwordHash }, t);
  await addMembership(company.id, user.id, 'admin', t);
  await audit(
    { companyId: company.id, actor: { id: user.id, name: user.name, email: user.email }, action: 'company.created', subjectUserId: user.id, target: company.name, detail: { plan: plan.code, trialDays: days } },
    meta,
    t,
  );
  return { userId: user.id, companyId: company.id };
}
