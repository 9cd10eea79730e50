import 'server-only';
import { randomBytes } from 'node:crypto';
import { cookies } from 'next/headers';
import { getEnv } from '@/server/env';
import { looksLikeToken } from './tokens';
import { clientDigest } from './throttle';

/**
 * The browser's sign-in client cookie: a random id, set the first time a browser tries to sign
 * in. It names the browser for the per-client sign-in limit and is what a browser is trusted by
 * (after the owner signs in from it, or follows the mailed unlock link). Only its digest is
 * stored. It proves nothing on its own: a stranger can drop it, which only moves them into the
 * stricter shared budgets.
 */
export const CLIENT_COOKIE = 'fl_client';
const ONE_YEAR_SECONDS = 365 * 24 * 3600;

export type SignInClient = { cookieDigest: string };

/** This browser's client, setting the cookie when it has none (call from actions only: cookies are read-only in pages). */
export async function currentSignInClient(): Promise<SignInClient> {
  const store = await cookies();
  let id = store.get(CLIENT_COOKIE)?.value;
  if (!looksLikeToken(id)) {
    id = randomBytes(32).toString('base64url');
    store.set(CLIENT_COOKIE, id, { httpOnly: true, sameSite: 'lax', secure: getEnv().APP_URL.startsWith('https:'), path: '/', maxAge: ONE_YEAR_SECONDS });
  }
  return { cookieDigest: clientDigest('cookie', id) };
}
