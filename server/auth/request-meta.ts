import 'server-only';
import { headers } from 'next/headers';
import { getEnv } from '@/server/env';

export type RequestMeta = { ip: string | null; userAgent: string | null };

/**
 * Where a request came from, for throttling, sessions and the audit log.
 *
 * Next.js fills X-Forwarded-For with the socket address only when the client sent none, so
 * without a proxy in front the header is whatever the client chose. We therefore read it only
 * when TRUST_PROXY says a load balancer of ours sets it, and then take the last entry: the one
 * our proxy appended (earlier entries came from the client). Otherwise the address is unknown.
 */
export function clientIpFrom(h: Headers, trustProxy: boolean): string | null {
  if (!trustProxy) return null;
  const forwarded = h.get('x-forwarded-for');
  if (!forwarded) return null;
  const parts = forwarded.split(',').map((p) => p.trim()).filter(Boolean);
  const last = parts.at(-1);
  if (!last) return null;
  return last.replace(/^::ffff:/, '').slice(0, 64);
}

export function requestMetaFrom(h: Headers, trustProxy = getEnv().TRUST_PROXY): RequestMeta {
  const ua = h.get('user-agent');
  return { ip: clientIpFrom(h, trustProxy), userAgent: ua ? ua.slice(0, 255) : null };
}

const IP_LITERAL = /^(?:\d{1,3}(?:\.\d{1,3}){3}|[0-9a-f:]{2,45}(?:%[\w.]{1,16})?)$/i;

/**
 * The address written into the audit log. Why every row used to say "address not recorded": the
 * log read clientIpFrom, which is null whenever TRUST_PROXY is off — the default, and every
 * single-server install. Behind our proxy (TRUST_PROXY) this is that same verified address.
 * Without one, the app faces the client directly and Next copies the socket's address into
 * X-Forwarded-For when the request brought none; a single IP literal there is taken as that
 * address. A client that sends its own header can still name another address, so this value
 * is a record for people, never a key for throttles or locks (those keep clientIpFrom).
 */
export function auditAddressFrom(h: Headers, trustProxy: boolean): string | null {
  if (trustProxy) return clientIpFrom(h, true);
  const forwarded = h.get('x-forwarded-for')?.trim();
  if (!forwarded || forwarded.includes(',')) return null;
  const ip = forwarded.replace(/^::ffff:/, '');
  return IP_LITERAL.test(ip) ? ip.slice(0, 64) : null;
}

/** The current request's meta (server actions, route handlers, server components). */
export async function getRequestMeta(): Promise<RequestMeta> {
  return requestMetaFrom(await headers());
}

/**
 * The current request's meta for the audit log, or nothing outside a request (a job, a script):
 * `headers()` throws there, and a change must not fail for want of an address.
 */
export async function currentRequestMeta(): Promise<RequestMeta> {
  let h: Headers;
  try {
    h = await headers();
  } catch {
    return { ip: null, userAgent: null };
  }
  const ua = h.get('user-agent');
  return { ip: auditAddressFrom(h, getEnv().TRUST_PROXY), userAgent: ua ? ua.slice(0, 255) : null };
}
