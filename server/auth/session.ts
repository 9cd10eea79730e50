import 'server-only';
import { cache } from 'react';
import { cookies } from 'next/headers';
import type { Session, User } from 'lucia';
import { getLucia } from './lucia';
import { hashToken } from './tokens';
import type { RequestMeta } from './request-meta';

export type ValidatedSession = { session: Session; user: User; token: string; digest: string };

/**
 * The current request's session, validated once per request (React cache). lucia extends a
 * session in the second half of its life; the refreshed cookie can only be written from an
 * action or route handler, so a server component that cannot write it simply skips that
 * (the next action will).
 */
export const validateRequest = cache(async (): Promise<ValidatedSession | null> => {
  const lucia = getLucia();
  const store = await cookies();
  const token = store.get(lucia.sessionCookieName)?.value ?? null;
  if (!token) return null;
  const result = await lucia.validateSession(token);
  try {
    if (result.session?.fresh) {
      const c = lucia.createSessionCookie(result.session.id);
      store.set(c.name, c.value, c.attributes);
    }
    if (!result.session) {
      const c = lucia.createBlankSessionCookie();
      store.set(c.name, c.value, c.attributes);
    }
  } catch {
    // Rendering a server component: cookies are read-only there.
  }
  if (!result.session) return null;
  return { session: result.session, user: result.user, token, digest: hashToken(token) };
});

/**
 * Opens a session for a person who just proved who they are, in the given company, and sets
 * the cookie. Expired sessions of everyone are swept here: sign-in is frequent enough to keep
 * the table small without a timer.
 */
export async function startSession(userId: string, activeCompanyId: number | null, meta: RequestMeta): Promise<{ token: string; digest: string }> {
  const lucia = getLucia();
  await lucia.deleteExpiredSessions();
  const session = await lucia.createSession(userId, { activeCompanyId, ip: meta.ip, userAgent: meta.userAgent });
  const c = lucia.createSessionCookie(session.id);
  (await cookies()).set(c.name, c.value, c.attributes);
  return { token: session.id, digest: hashToken(session.id) };
}

/** Ends the current session (if any) and clears the cookie. */
export async function endCurrentSession(): Promise<void> {
  const lucia = getLucia();
  const store = await cookies();
  const token = store.get(lucia.sessionCookieName)?.value;
  if (token) await lucia.invalidateSession(token);
  const c = lucia.createBlankSessionCookie();
  store.set(c.name, c.value, c.attributes);
}

/** Clears the cookie without touching the database (after "sign out everywhere"). */
export async function clearSessionCookie(): Promise<void> {
  const c = getLucia().createBlankSessionCookie();
  (await cookies()).set(c.name, c.value, c.attributes);
}
