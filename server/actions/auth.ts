'use server';

import { redirect } from 'next/navigation';
import { z } from 'zod';
import { safeAction } from './safe-action';
import {
  acceptExistingAccountSchema,
  acceptNewAccountSchema,
  requestResetSchema,
  resetPasswordSchema,
  safeNextPath,
  signInSchema,
  signUpConfirmSchema,
  signUpSchema,
} from '@/server/auth/schemas';
import { checkCredentials } from '@/server/auth/credentials';
import { confirmSignUp as spendSignUpLink, requestSignUp } from '@/server/auth/sign-up';
import { requestPasswordReset as sendResetLink, resetPassword as spendResetLink } from '@/server/auth/password-reset';
import { acceptAsExistingUser, acceptAsNewAccount, inspectInvitation } from '@/server/auth/invitations';
import { endCurrentSession, startSession } from '@/server/auth/session';
import { getAuthContext } from '@/server/auth/guards';
import { getRequestMeta } from '@/server/auth/request-meta';
import { sweepOldAttempts } from '@/server/auth/throttle';
import { currentSignInClient } from '@/server/auth/sign-in-client';
import { spendUnlockLink } from '@/server/auth/sign-in-unlock';
import { trustClient } from '@/db/queries/sign-in-trust';
import { audit } from '@/server/auth/audit';
import { firstMembership } from '@/db/queries/team';
import { InvalidInputError } from '@/server/errors';

/**
 * Sign up, step one: always the same answer, whether or not the address has an account; the
 * mail says which (a confirmation link, or "you already have an account").
 */
export const signUp = safeAction({ schema: signUpSchema, permission: 'public' }, async (input) => {
  const message = await requestSignUp(input, await getRequestMeta());
  return { message };
});

/** Sign up, step two (the mailed link): a new company on the trial plan with the signer as admin, then in. */
export const confirmSignUp = safeAction({ schema: signUpConfirmSchema, permission: 'public' }, async (input) => {
  const meta = await getRequestMeta();
  const { userId, companyId } = await spendSignUpLink(input.token, meta);
  await endCurrentSession();
  await startSession(userId, companyId, meta);
  redirect('/dashboard?welcome=1');
});

export const signIn = safeAction({ schema: signInSchema, permission: 'public' }, async (input) => {
  const meta = await getRequestMeta();
  const user = await checkCredentials(input.email, input.password, meta);
  let companyId: number | null = null;
  if (!user.isStaff) {
    const membership = await firstMembership(user.id);
    if (!membership) throw new InvalidInputError('This account is not part of any company any more. Ask an admin of your company to invite you again.');
    companyId = membership.company.id;
  }
  await startSession(user.id, companyId, meta);
  await audit({ companyId, actor: { id: user.id, name: user.name, email: user.email }, action: 'session.signed_in', subjectUserId: user.id }, meta);
  await sweepOldAttempts();
  redirect(safeNextPath(input.next) ?? (user.isStaff ? '/staff' : '/dashboard'));
});

export const signOut = safeAction({ schema: z.object({}), permission: 'public' }, async () => {
  const ctx = await getAuthContext();
  if (ctx) await audit({ companyId: ctx.companyId, actor: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email }, action: 'session.signed_out', subjectUserId: ctx.user.id }, await getRequestMeta());
  await endCurrentSession();
  redirect('/sign-in?signed-out=1');
});

/** Always the same answer, whether or not the address has an account. */
export const requestPasswordReset = safeAction({ schema: requestResetSchema, permission: 'public' }, async (input) => {
  const message = await sendResetLink(input.email, await getRequestMeta());
  return { message };
});

export const resetPassword = safeAction({ schema: resetPasswordSchema, permission: 'public' }, async (input) => {
  const { email } = await spendResetLink(input.token, input.password, await getRequestMeta());
  // Whoever read the mailbox may sign in from this browser whatever strangers try at the address.
  await trustClient(email, (await currentSignInClient()).cookieDigest);
  redirect('/sign-in?reset=1');
});

/** The mailed unlock link's button: this browser may sign in to the address past the shared limits. */
export const unlockSignIn = safeAction({ schema: signUpConfirmSchema, permission: 'public' }, async (input) => {
  await spendUnlockLink(input.token, await currentSignInClient(), await getRequestMeta());
  redirect('/sign-in?unlocked=1');
});

/** Invitation for an address without an account: create it, join, and sign in. */
export const acceptInvitation = safeAction({ schema: acceptNewAccountSchema, permission: 'public' }, async (input) => {
  const meta = await getRequestMeta();
  const { userId, companyId } = await acceptAsNewAccount(input.token, input, meta);
  await endCurrentSession();
  await startSession(userId, companyId, meta);
  redirect('/dashboard?joined=1');
});

/**
 * Invitation for an existing account: signed in as that account, one click; otherwise its
 * password, checked under the sign-in throttle. Then the session works in the new company.
 */
export const acceptInvitationWithAccount = safeAction({ schema: acceptExistingAccountSchema, permission: 'public' }, async (input) => {
  const meta = await getRequestMeta();
  const view = await inspectInvitation(input.token);
  if (view.state !== 'valid') throw new InvalidInputError(view.message);
  const ctx = await getAuthContext();
  let user: { id: string; name: string; email: string };
  if (ctx && ctx.user.email === view.email) {
    user = ctx.user;
  } else {
    if (!input.password) throw new InvalidInputError('Enter your password to accept.', { password: ['Enter your password.'] });
    user = await checkCredentials(view.email, input.password, meta);
  }
  const { companyId } = await acceptAsExistingUser(input.token, user, meta);
  await endCurrentSession();
  await startSession(user.id, companyId, meta);
  redirect('/dashboard?joined=1');
});
