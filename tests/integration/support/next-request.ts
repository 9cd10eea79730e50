import { vi } from 'vitest';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { getURLFromRedirectError } from 'next/dist/client/components/redirect';
import { isHTTPAccessFallbackError, getAccessFallbackHTTPStatus } from 'next/dist/client/components/http-access-fallback/http-access-fallback';
import type { ActionState } from '@/server/actions/safe-action';

/**
 * The request a server action or server component sees, for integration tests: `next/headers`
 * (cookies(), headers()) and `next/cache` are replaced by an in-memory request that the test
 * controls. Import this module FIRST in a test file (before any server module).
 *
 *   asUser(token)            the cookie jar holds that session token
 *   asSignedOut()            no cookie
 *   setRequestHeaders({...}) e.g. { 'x-forwarded-for': '203.0.113.7', 'user-agent': 'test' }
 *   inRequest(token, fn)     fn runs as its own request (concurrent requests as different people)
 *   callAction(action, input) → { state } | { redirect } | { notFound: status }
 */
type StoredCookie = { name: string; value: string; [attribute: string]: unknown };

type RequestState = { cookies: Map<string, { name: string; value: string; [attribute: string]: unknown }>; headers: Headers; revalidated: string[] };

const shared = await vi.hoisted(async () => {
  // Hoisted above the imports, so the module is loaded here.
  const { AsyncLocalStorage } = await import('node:async_hooks');
  const global: RequestState = { cookies: new Map(), headers: new Headers({ 'user-agent': 'vitest integration' }), revalidated: [] };
  // Concurrent requests each get their own jar through inRequest(); everything else uses the global one.
  const scoped = new AsyncLocalStorage<RequestState>();
  return { global, scoped, current: (): RequestState => scoped.getStore() ?? global };
});
const request = {
  get cookies() {
    return shared.current().cookies;
  },
  get headers() {
    return shared.current().headers;
  },
  set headers(h: Headers) {
    shared.current().headers = h;
  },
  get revalidated() {
    return shared.current().revalidated;
  },
};

vi.mock('next/headers', () => {
  const request = { get cookies() { return shared.current().cookies; }, get headers() { return shared.current().headers; } };
  const store = {
    get: (name: string) => {
      const c = request.cookies.get(name);
      return c && c.value !== '' ? { name: c.name, value: c.value } : undefined;
    },
    getAll: (name?: string) => [...request.cookies.values()].filter((c) => c.value !== '' && (!name || c.name === name)).map((c) => ({ name: c.name, value: c.value })),
    has: (name: string) => Boolean(request.cookies.get(name)?.value),
    set: (nameOrCookie: string | { name: string; value: string }, value?: string, attributes?: Record<string, unknown>) => {
      const cookie = typeof nameOrCookie === 'string' ? { name: nameOrCookie, value: value ?? '', ...(attributes ?? {}) } : { ...nameOrCookie };
      request.cookies.set(cookie.name, cookie as { name: string; value: string });
      return store;
    },
    delete: (name: string) => {
      request.cookies.delete(name);
      return store;
    },
    toString: () => [...request.cookies.values()].map((c) => `${c.name}=${c.value}`).join('; '),
  };
  return {
    cookies: async () => store,
    headers: async () => request.headers,
    draftMode: async () => ({ isEnabled: false, enable() {}, disable() {} }),
  };
});

vi.mock('next/cache', () => ({
  revalidatePath: (path: string) => {
    shared.current().revalidated.push(path);
  },
  revalidateTag: (tag: string) => {
    shared.current().revalidated.push(`tag:${tag}`);
  },
  updateTag: (tag: string) => {
    shared.current().revalidated.push(`tag:${tag}`);
  },
  refresh: () => {},
  unstable_noStore: () => {},
  unstable_cache: <T extends (...args: never[]) => unknown>(fn: T) => fn,
}));

export const SESSION_COOKIE = 'fl_session';

export function asUser(sessionToken: string): void {
  request.cookies.clear();
  request.cookies.set(SESSION_COOKIE, { name: SESSION_COOKIE, value: sessionToken });
}

export function asSignedOut(): void {
  request.cookies.clear();
}

/**
 * Runs fn as its own request with its own cookie jar, so several requests can be in flight at
 * once (each as a different person): `await Promise.all([inRequest(a, () => …), inRequest(b, () => …)])`.
 */
export function inRequest<T>(sessionToken: string | null, fn: () => Promise<T>, headers: Record<string, string> = {}): Promise<T> {
  const state: RequestState = { cookies: new Map(), headers: new Headers({ 'user-agent': 'vitest integration', ...headers }), revalidated: [] };
  if (sessionToken) state.cookies.set(SESSION_COOKIE, { name: SESSION_COOKIE, value: sessionToken });
  return shared.scoped.run(state, fn);
}

export function setRequestHeaders(values: Record<string, string>): void {
  request.headers = new Headers({ 'user-agent': 'vitest integration', ...values });
}

/** The cookie as last written by the code under test (with its attributes), if any. */
export function writtenCookie(name = SESSION_COOKIE): StoredCookie | undefined {
  return request.cookies.get(name);
}

/** The session token the code under test left in the jar (after sign-in etc.). */
export function currentSessionToken(): string | null {
  const c = request.cookies.get(SESSION_COOKIE);
  return c && c.value ? c.value : null;
}

export function revalidatedPaths(): string[] {
  return [...request.revalidated];
}

export type ActionOutcome<T = unknown> = { state: ActionState<T>; redirect?: undefined; notFound?: undefined } | { redirect: string; state?: undefined; notFound?: undefined } | { notFound: number; state?: undefined; redirect?: undefined };

/** Runs an action (or a guard) the way Next would, turning redirect()/notFound() into values. */
export async function callAction<T>(action: (prev: ActionState<T> | null, input: FormData | Record<string, unknown>) => Promise<ActionState<T>>, input: FormData | Record<string, unknown> = {}): Promise<ActionOutcome<T>> {
  try {
    return { state: await action(null, input) };
  } catch (error) {
    const interrupted = interruption(error);
    if (interrupted) return interrupted;
    throw error;
  }
}

/** Runs page code (requireUser, requireRole…) and reports redirects and 404s as values. */
export async function callPage<T>(fn: () => Promise<T>): Promise<{ value: T } | { redirect: string } | { notFound: number }> {
  try {
    return { value: await fn() };
  } catch (error) {
    const interrupted = interruption(error);
    if (interrupted) return interrupted;
    throw error;
  }
}

function interruption(error: unknown): { redirect: string } | { notFound: number } | null {
  if (isRedirectError(error)) return { redirect: getURLFromRedirectError(error) };
  if (isHTTPAccessFallbackError(error)) return { notFound: getAccessFallbackHTTPStatus(error) };
  return null;
}

/** A Request for a route handler, with the test's cookie jar and headers. */
export function apiRequest(path: string, init: { method?: string; json?: unknown; headers?: Record<string, string> } = {}): Request {
  const headers = new Headers(request.headers);
  const cookie = [...request.cookies.values()].filter((c) => c.value).map((c) => `${c.name}=${c.value}`).join('; ');
  if (cookie) headers.set('cookie', cookie);
  if (init.json !== undefined) headers.set('content-type', 'application/json');
  for (const [k, v] of Object.entries(init.headers ?? {})) headers.set(k, v);
  return new Request(new URL(path, process.env.APP_URL ?? 'http://localhost:3100'), {
    method: init.method ?? 'GET',
    headers,
    body: init.json !== undefined ? JSON.stringify(init.json) : undefined,
  });
}
