'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { z } from 'zod';
import { safeAction } from './safe-action';
import { changePasswordSchema, sessionDigestSchema, switchCompanySchema } from '@/server/auth/schemas';
import { getRequestMeta } from '@/server/auth/request-meta';
import { clearSessionCookie, endCurrentSession } from '@/server/auth/session';
import { checkCredentials } from '@/server/auth/credentials';
import { hashPassword } from '@/server/auth/password';
import { audit } from '@/server/auth/audit';
import { deleteAllUserSessions, deleteUserSession, deleteUserSessionsExcept, setSessionActiveCompany } from '@/db/queries/sessions';
import { setUserPassword } from '@/db/queries/users';
import { findMembership } from '@/db/queries/team';
import { models } from '@/db/models';
import { InvalidInputError, NotFoundError } from '@/server/errors';

const SECURITY_PAGES = ['/settings/security', '/staff/security'];
const refreshSecurityPages = () => SECURITY_PAGES.forEach((p) => revalidatePath(p));

/** Ends one of one's own sessions (another device); ending the current one is signing out. */
export const revokeSession = safeAction({ schema: sessionDigestSchema, permission: 'signed-in' }, async (input, ctx) => {
  const meta = await getRequestMeta();
  if (input.session === ctx.sessionId) {
    await endCurrentSession();
    redirect('/sign-in?signed-out=1');
  }
  const n = await deleteUserSession(ctx.user.id, input.session);
  if (n === 0) throw new NotFoundError('That session');
  await audit({ companyId: ctx.companyId, actor: ctx.user, action: 'session.revoked', subjectUserId: ctx.user.id }, meta);
  refreshSecurityPages();
  return { message: 'That device is signed out.' };
});

export const signOutEverywhere = safeAction({ schema: z.object({}), permission: 'signed-in' }, async (_input, ctx) => {
  const meta = await getRequestMeta();
  const n = await deleteAllUserSessions(ctx.user.id);
  await audit({ companyId: ctx.companyId, actor: ctx.user, action: 'session.signed_out_everywhere', subjectUserId: ctx.user.id, detail: { sessions: n } }, meta);
  await clearSessionCookie();
  redirect('/sign-in?signed-out=everywhere');
});

/** Needs the current password; every other session ends, this one stays. */
export const changePassword = safeAction({ schema: changePasswordSchema, permission: 'signed-in' }, async (input, ctx) => {
  const meta = await getRequestMeta();
  try {
    await checkCredentials(ctx.user.email, input.current, meta);
  } catch (error) {
    if (error instanceof InvalidInputError) throw new InvalidInputError('Your current password is not right.', { current: ['Not right.'] });
    throw error;
  }
  const passwordHash = await hashPassword(input.password);
  await models().sequelize.transaction(async (t) => {
    await setUserPassword(ctx.user.id, passwordHash, t);
    await deleteUserSessionsExcept(ctx.user.id, ctx.sessionId, t);
    await audit({ companyId: ctx.companyId, actor: ctx.user, action: 'password.changed', subjectUserId: ctx.user.id }, meta, t);
  });
  refreshSecurityPages();
  return { message: 'Password changed. Your other devices are signed out.' };
});

/** Work in another company the person belongs to. */
export const switchCompany = safeAction({ schema: switchCompanySchema, permission: 'signed-in' }, async (input, ctx) => {
  const membership = await findMembership(ctx.user.id, input.companyId);
  if (!membership) throw new NotFoundError('That company');
  await setSessionActiveCompany(ctx.sessionId, membership.company.id);
  redirect('/dashboard');
});
