import 'server-only';
import { randomBytes } from 'node:crypto';
import { InvalidInputError } from '@/server/errors';
import { findUserByEmail, normaliseEmail, type UserRow } from '@/db/queries/users';
import { hashPassword, verifyPassword } from './password';
import { claimAttempt, clientDigest, forgiveAddress, settleAttempt, type Attempt } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';
import { currentSignInClient } from './sign-in-client';
import { isTrustedClient, trustClient } from '@/db/queries/sign-in-trust';
import { offerUnlockLink } from './sign-in-unlock';

export const WRONG_CREDENTIALS = 'That e-mail address and password do not match an account.';

const holder = globalThis as unknown as { __fadeledgerDummyHash?: Promise<string> };

/**
 * A real argon2id hash of a random password, made once per process: checking an unknown
 * address against it costs the same time as checking a known one, so timing tells nothing.
 */
function dummyHash(): Promise<string> {
  holder.__fadeledgerDummyHash ??= hashPassword(randomBytes(18).toString('base64url'));
  return holder.__fadeledgerDummyHash;
}

/** A refusal answers no sooner than this, whether or not the address has an account (a mail may go out for one). */
export const REFUSAL_FLOOR_MS = 700;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Checks an address and password under the sign-in throttle (server/auth/throttle.ts). The
 * client is this browser: behind a trusted proxy an untrusted browser is known by its IP, a
 * trusted one always by its own cookie. The attempt is recorded as a failure before argon2 runs
 * and only marked good afterwards, so parallel guesses each take a slot and at most the limit
 * reach the comparison. The comparison is argon2's own constant-time verify; unknown addresses
 * run a dummy verify. The failure message does not say which half was wrong.
 *
 * A refusal offers the owner a mailed link that lets their browser past the limits; it is
 * answered after the same floor whether or not a mail went out.
 */
export async function checkCredentials(emailInput: string, password: string, meta: RequestMeta): Promise<UserRow> {
  const email = normaliseEmail(emailInput);
  const browser = await currentSignInClient();
  const trusted = await isTrustedClient(email, browser.cookieDigest);
  const client = !trusted && meta.ip ? clientDigest('ip', meta.ip) : browser.cookieDigest;
  let attempt: Attempt;
  try {
    attempt = await claimAttempt('sign_in', { email, ip: meta.ip, client, trusted });
  } catch (error) {
    const started = Date.now();
    const user = await findUserByEmail(email);
    if (user) {
      await audit({ companyId: null, actor: null, action: 'session.sign_in_throttled', subjectUserId: user.id, target: email }, meta);
      await offerUnlockLink(email, meta);
    }
    const left = REFUSAL_FLOOR_MS - (Date.now() - started);
    if (left > 0) await sleep(left);
    throw error;
  }
  const user = await findUserByEmail(email);
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await dummyHash(), password), false);
  if (!user || !ok) {
    if (user) await audit({ companyId: null, actor: null, action: 'session.sign_in_failed', subjectUserId: user.id, target: email }, meta);
    throw new InvalidInputError(WRONG_CREDENTIALS);
  }
  await settleAttempt(attempt);
  // This browser proved it knows the password: it is trusted for the address from now on, and
  // its own earlier failures are forgotten (not those of other clients).
  await trustClient(email, browser.cookieDigest);
  await forgiveAddress('sign_in', email, [...new Set([client, browser.cookieDigest])]);
  return user;
}
