import 'server-only';
import { models } from '@/db/models';
import { getEnv } from '@/server/env';
import { InvalidInputError } from '@/server/errors';
import { findUserByEmail, findUserById, normaliseEmail, setUserPassword } from '@/db/queries/users';
import { createPasswordResetToken, deleteStaleResetTokens, findResetTokenByHash, markResetTokenUsed } from '@/db/queries/password-resets';
import { deleteAllUserSessions } from '@/db/queries/sessions';
import { sendMail } from '@/server/mail/send';
import { passwordResetMail } from '@/server/mail/templates/password-reset';
import { hashPassword } from './password';
import { hashToken, newToken } from './tokens';
import { assertNotThrottled, forgiveAddress, recordAttempt } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';

export const RESET_LINK_MINUTES = 60;
/** Both answers (account or not) take at least this long, so timing does not tell them apart. */
export const RESET_RESPONSE_FLOOR_MS = 700;

export const RESET_REQUESTED_MESSAGE = `If an account uses that address, we have sent it a link to choose a new password. The link works once, within ${RESET_LINK_MINUTES} minutes.`;
export const RESET_LINK_DEAD = 'This reset link has expired or has already been used. Ask for a new one below.';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Sends a reset link when the address has an account, and says the same thing either way.
 * A mail server failure is logged, not shown: showing it only for real accounts would tell.
 */
export async function requestPasswordReset(emailInput: string, meta: RequestMeta): Promise<string> {
  const started = Date.now();
  const email = normaliseEmail(emailInput);
  await assertNotThrottled('reset_request', { email, ip: meta.ip });
  await recordAttempt('reset_request', { email, ip: meta.ip }, true);
  const user = await findUserByEmail(email);
  if (user) {
    const token = newToken();
    const expiresAt = new Date(Date.now() + RESET_LINK_MINUTES * 60_000);
    await deleteStaleResetTokens();
    await createPasswordResetToken({ userId: user.id, tokenHash: hashToken(token), expiresAt, requestedIp: meta.ip });
    await audit({ companyId: null, actor: null, action: 'password.reset_requested', subjectUserId: user.id, target: user.email }, meta);
    try {
      const url = `${getEnv().APP_URL.replace(/\/$/, '')}/reset-password/${token}`;
      await sendMail({ to: user.email, ...passwordResetMail({ name: user.name, resetUrl: url, expiresAt }) });
    } catch (error) {
      console.error('password reset mail not sent:', (error as Error).message);
    }
  }
  const left = RESET_RESPONSE_FLOOR_MS - (Date.now() - started);
  if (left > 0) await sleep(left);
  return RESET_REQUESTED_MESSAGE;
}

export type ResetLinkState = { state: 'valid'; email: string } | { state: 'dead' };

/** What the reset page shows before the form is sent. */
export async function inspectResetLink(token: string): Promise<ResetLinkState> {
  const row = await findResetTokenByHash(hashToken(token));
  if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) return { state: 'dead' };
  const user = await findUserById(row.userId);
  return user ? { state: 'valid', email: user.email } : { state: 'dead' };
}

/**
 * Sets the new password and spends the link, in one transaction with the link row locked, so
 * two tabs submitting at once cannot both use it. Every session of the person ends.
 */
export async function resetPassword(token: string, password: string, meta: RequestMeta): Promise<{ email: string }> {
  const passwordHash = await hashPassword(password);
  const { sequelize } = models();
  const email = await sequelize.transaction(async (t) => {
    const row = await findResetTokenByHash(hashToken(token), t, true);
    if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) throw new InvalidInputError(RESET_LINK_DEAD);
    const user = await findUserById(row.userId, t);
    if (!user) throw new InvalidInputError(RESET_LINK_DEAD);
    await markResetTokenUsed(row.id, t);
    await setUserPassword(user.id, passwordHash, t);
    await deleteAllUserSessions(user.id, t);
    await audit({ companyId: null, actor: { id: user.id, name: user.name, email: user.email }, action: 'password.reset', subjectUserId: user.id, target: user.email }, meta, t);
    return user.email;
  });
  // They proved they read the mailbox: earlier wrong guesses no longer lock them out.
  await forgiveAddress('sign_in', email);
  return { email };
}
