import { getEnv } from '@/server/env';

/** Longer than any page of ours with its query; a longer value is refused, never cut short. */
const MAX_NEXT_LENGTH = 500;

// Browsers drop tab/CR/LF anywhere in a URL and read "\" as "/" (WHATWG URL parser), so
// "/\t/evil.example" lands on evil.example. Any C0 control, DEL or backslash is refused outright.
const UNSAFE_CHARACTERS = /[\u0000-\u001f\u007f\\]/;

/**
 * Only same-site paths may be "where to go after signing in". The value is resolved against
 * APP_URL the way a browser would, must keep our origin, and only its path, query and fragment
 * are returned, so what we redirect to is what we checked. Null means "use the default page".
 */
export function safeNextPath(next: string | undefined | null, appUrl: string = getEnv().APP_URL): string | null {
  if (typeof next !== 'string' || next.length === 0 || next.length > MAX_NEXT_LENGTH) return null;
  if (!next.startsWith('/') || UNSAFE_CHARACTERS.test(next)) return null;
  let base: URL;
  let resolved: URL;
  try {
    base = new URL(appUrl);
    resolved = new URL(next, base);
  } catch {
    return null;
  }
  if (resolved.origin !== base.origin) return null;
  const path = `${resolved.pathname}${resolved.search}${resolved.hash}`;
  // "/..//x" resolves to the path "//x", which a browser would read as another host.
  if (!path.startsWith('/') || path.startsWith('//')) return null;
  return path;
}
