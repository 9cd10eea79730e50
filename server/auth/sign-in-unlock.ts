import 'server-only';
import { models } from '@/db/models';
import { getEnv } from '@/server/env';
import { InvalidInputError } from '@/server/errors';
import { findUserByEmail, findUserById, lockUser } from '@/db/queries/users';
import { findUnlockTokenByHash, markUnlockTokenUsed, recentLiveUnlockToken, replaceUnlockTokens, trustClient } from '@/db/queries/sign-in-trust';
import { sendMail } from '@/server/mail/send';
import { signInUnlockMail } from '@/server/mail/templates/sign-in-unlock';
import { hashToken, newToken } from './tokens';
import { clientDigest, forgiveAddress } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';
import type { SignInClient } from './sign-in-client';

export const UNLOCK_LINK_MINUTES = 60;
/** However often sign-in is refused, at most one link per this many minutes reaches the inbox. */
export const UNLOCK_MAIL_EVERY_MINUTES = 15;
export const UNLOCK_LINK_DEAD = 'This link has expired or has already been used. Try signing in; if you are held back again, we will e-mail you a new one.';

/**
 * Mails the owner of an address a link that lets one browser past the sign-in limits, when sign-in
 * has just been refused for it. Nothing happens for an address without an account, and nothing
 * if a live link went out in the last UNLOCK_MAIL_EVERY_MINUTES (a stranger hammering the door
 * cannot flood the inbox). A mail server failure is logged, not shown.
 */
export async function offerUnlockLink(email: string, meta: RequestMeta): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user) return;
  const token = newToken();
  const expiresAt = new Date(Date.now() + UNLOCK_LINK_MINUTES * 60_000);
  // With the person's row locked, two refusals at once cannot both decide to mail.
  const stored = await models().sequelize.transaction(async (t) => {
    if (!(await lockUser(user.id, t))) return false;
    if (await recentLiveUnlockToken(user.id, new Date(Date.now() - UNLOCK_MAIL_EVERY_MINUTES * 60_000), t)) return false;
    await replaceUnlockTokens({ userId: user.id, tokenHash: hashToken(token), expiresAt }, t);
    await audit({ companyId: null, actor: null, action: 'session.unlock_link_sent', subjectUserId: user.id, target: user.email }, meta, t);
    return true;
  });
  if (!stored) return;
  try {
    const url = `${getEnv().APP_URL.replace(/\/$/, '')}/unlock/${token}`;
    await sendMail({ to: user.email, ...signInUnlockMail({ name: user.name, unlockUrl: url, expiresAt }) });
  } catch (error) {
    console.error('sign-in unlock mail not sent:', (error as Error).message);
  }
}

export type UnlockLinkState = { state: 'valid'; email: string } | { state: 'dead' };

/** What the unlock page shows before its button is pressed (opening the link changes nothing: mail scanners open links too). */
export async function inspectUnlockLink(token: string): Promise<UnlockLinkState> {
  const row = await findUnlockTokenByHash(hashToken(token));
  if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) return { state: 'dead' };
  const user = await findUserById(row.userId);
  return user ? { state: 'valid', email: user.email } : { state: 'dead' };
}

/**
 * Spends the link and trusts the browser that pressed the button for that address, in one
 * transaction with the person and link rows locked (two tabs cannot both spend it). That
 * browser's earlier failures are forgotten; what strangers did stays counted against them.
 */
export async function spendUnlockLink(token: string, client: SignInClient, meta: RequestMeta): Promise<{ email: string }> {
  const email = await models().sequelize.transaction(async (t) => {
    const seen = await findUnlockTokenByHash(hashToken(token), t);
    if (!seen) throw new InvalidInputError(UNLOCK_LINK_DEAD);
    const user = await lockUser(seen.userId, t);
    if (!user) throw new InvalidInputError(UNLOCK_LINK_DEAD);
    const row = await findUnlockTokenByHash(hashToken(token), t, true);
    if (!row || row.userId !== user.id || row.usedAt || row.expiresAt.getTime() <= Date.now()) throw new InvalidInputError(UNLOCK_LINK_DEAD);
    await markUnlockTokenUsed(row.id, t);
    await trustClient(user.email, client.cookieDigest, t);
    await audit({ companyId: null, actor: null, action: 'session.unlocked', subjectUserId: user.id, target: user.email }, meta, t);
    return user.email;
  });
  await forgiveAddress('sign_in', email, [client.cookieDigest, ...(meta.ip ? [clientDigest('ip', meta.ip)] : [])]);
  return { email };
}
