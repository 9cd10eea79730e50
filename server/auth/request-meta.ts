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

/** The current request's meta (server actions, route handlers, server components). */
export async function getRequestMeta(): Promise<RequestMeta> {
  return requestMetaFrom(await headers());
}
