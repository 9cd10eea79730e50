import 'server-only';
import { models } from '@/db/models';
import { getEnv } from '@/server/env';
import { InvalidInputError } from '@/server/errors';
import { findUserByEmail, findUserById, lockUser, normaliseEmail, setUserPassword } from '@/db/queries/users';
import { deleteStaleResetTokens, findResetTokenByHash, markResetTokenUsed, replaceResetTokens } from '@/db/queries/password-resets';
import { deleteAllUserSessions } from '@/db/queries/sessions';
import { sendMail } from '@/server/mail/send';
import { passwordResetMail } from '@/server/mail/templates/password-reset';
import { hashPassword } from './password';
import { hashToken, newToken } from './tokens';
import { claimAttempt, forgiveAddress, settleAttempt } from './throttle';
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
  const attempt = await claimAttempt('reset_request', { email, ip: meta.ip });
  const user = await findUserByEmail(email);
  if (user) {
    const token = newToken();
    const expiresAt = new Date(Date.now() + RESET_LINK_MINUTES * 60_000);
    await deleteStaleResetTokens();
    // One transaction with the person's row locked: two requests at once queue here instead of
    // deadlocking, the later one retires the earlier link, and the link exists only if its
    // audit row does too.
    const { sequelize } = models();
    const stored = await sequelize.transaction(async (t) => {
      if (!(await lockUser(user.id, t))) return false; // deleted a moment ago
      await replaceResetTokens({ userId: user.id, tokenHash: hashToken(token), expiresAt, requestedIp: meta.ip }, t);
      await audit({ companyId: null, actor: null, action: 'password.reset_requested', subjectUserId: user.id, target: user.email }, meta, t);
      return true;
    });
    if (stored) {
      try {
        const url = `${getEnv().APP_URL.replace(/\/$/, '')}/reset-password/${token}`;
        await sendMail({ to: user.email, ...passwordResetMail({ name: user.name, resetUrl: url, expiresAt }) });
      } catch (error) {
        console.error('password reset mail not sent:', (error as Error).message);
      }
    }
  }
  await settleAttempt(attempt);
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
 * Sets the new password and spends the link, in one transaction with the person and link rows locked, so
 * two tabs submitting at once cannot both use it. Every session of the person ends.
 */
export async function resetPassword(token: string, password: string, meta: RequestMeta): Promise<{ email: string }> {
  const passwordHash = await hashPassword(password);
  const { sequelize } = models();
  const email = await sequelize.transaction(async (t) => {
    // Person first, then link: the same order as requestPasswordReset, so the two never deadlock.
    const seen = await findResetTokenByHash(hashToken(token), t);
    if (!seen) throw new InvalidInputError(RESET_LINK_DEAD);
    const user = await lockUser(seen.userId, t);
    if (!user) throw new InvalidInputError(RESET_LINK_DEAD);
    const row = await findResetTokenByHash(hashToken(token), t, true);
    if (!row || row.userId !== user.id || row.usedAt || row.expiresAt.getTime() <= Date.now()) throw new InvalidInputError(RESET_LINK_DEAD);
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
