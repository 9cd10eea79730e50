import 'server-only';
import { randomBytes } from 'node:crypto';
import { InvalidInputError } from '@/server/errors';
import { findUserByEmail, normaliseEmail, type UserRow } from '@/db/queries/users';
import { hashPassword, verifyPassword } from './password';
import { claimAttempt, forgiveAddress, settleAttempt, type Attempt } from './throttle';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';

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

/**
 * Checks an address and password under the sign-in throttle (per address and per IP). The
 * attempt is recorded as a failure before argon2 runs and only marked good afterwards, so
 * parallel guesses each take a slot and at most the limit reach the comparison. The comparison
 * is argon2's own constant-time verify; unknown addresses run a dummy verify. The failure
 * message does not say which half was wrong.
 */
export async function checkCredentials(emailInput: string, password: string, meta: RequestMeta): Promise<UserRow> {
  const email = normaliseEmail(emailInput);
  let attempt: Attempt;
  try {
    attempt = await claimAttempt('sign_in', { email, ip: meta.ip });
  } catch (error) {
    const user = await findUserByEmail(email);
    if (user) await audit({ companyId: null, actor: null, action: 'session.sign_in_throttled', subjectUserId: user.id, target: email }, meta);
    throw error;
  }
  const user = await findUserByEmail(email);
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await dummyHash(), password), false);
  if (!user || !ok) {
    if (user) await audit({ companyId: null, actor: null, action: 'session.sign_in_failed', subjectUserId: user.id, target: email }, meta);
    throw new InvalidInputError(WRONG_CREDENTIALS);
  }
  await settleAttempt(attempt);
  await forgiveAddress('sign_in', email);
  return user;
}
