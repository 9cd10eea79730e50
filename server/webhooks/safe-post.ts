import { lookup as dnsLookup } from 'node:dns/promises';
import http from 'node:http';
import https from 'node:https';
import { isIP, type LookupFunction } from 'node:net';
import { isPublicAddress } from './address-check';

/** One attempt's outcome: `ok` only for a 2xx answer; anything else says why in words. */
export type PostOutcome = { ok: boolean; status: number | null; error: string | null };

export type SafePostOptions = {
  /** Local testing only (WEBHOOKS_ALLOW_PRIVATE_TARGETS): http:// and private addresses allowed. */
  allowPrivate: boolean;
  timeoutMs?: number;
  /** How much of the answer is read before the connection is dropped. */
  maxResponseBytes?: number;
};

export const DEFAULT_TIMEOUT_MS = 5_000;
export const DEFAULT_MAX_RESPONSE_BYTES = 4_096;

/** Why a URL may not be delivered to before any lookup, or null. Shared with the registration form. */
export function urlRefusal(raw: string, allowPrivate: boolean): string | null {
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    return 'Enter a full address such as https://orders.example.com/fadeledger-events.';
  }
  if (url.protocol !== 'https:' && !(allowPrivate && url.protocol === 'http:')) return 'The address must start with https://.';
  if (url.username || url.password) return 'Leave user names and passwords out of the address; check the signature instead.';
  if (url.hash) return 'Leave the #fragment out of the address.';
  const host = url.hostname.replace(/^\[|\]$/g, '');
  if (!allowPrivate) {
    if (isIP(host) && !isPublicAddress(host)) return 'That address is private, loopback or link-local; webhooks go only to public addresses.';
    if (/^localhost$|\.localhost$|\.local$|\.internal$/i.test(host)) return 'That host name is local; webhooks go only to public addresses.';
  }
  return null;
}

/**
 * POSTs `body` to exactly `rawUrl` — never anywhere else:
 *   - https only (http only with allowPrivate);
 *   - the host is resolved first and EVERY address checked; the connection is then pinned to the
 *     checked address (a custom lookup), so a DNS answer that changes between check and connect
 *     (rebinding) cannot redirect it, while TLS still verifies the certificate for the host name;
 *   - redirects are never followed: a 3xx is a failed attempt;
 *   - short timeout for the whole exchange; at most maxResponseBytes of the answer are read.
 */
export async function safePost(rawUrl: string, body: string, headers: Record<string, string>, opts: SafePostOptions): Promise<PostOutcome> {
  const refusal = urlRefusal(rawUrl, opts.allowPrivate);
  if (refusal) return { ok: false, status: null, error: refusal };
  const url = new URL(rawUrl);
  const host = url.hostname.replace(/^\[|\]$/g, '');
  let addresses: { address: string; family: number }[];
  try {
    addresses = isIP(host) ? [{ address: host, family: isIP(host) }] : await dnsLookup(host, { all: true, verbatim: true });
  } catch (e) {
    return { ok: false, status: null, error: `The host name did not resolve (${(e as NodeJS.ErrnoException).code ?? 'lookup failed'}).` };
  }
  if (addresses.length === 0) return { ok: false, status: null, error: 'The host name did not resolve.' };
  if (!opts.allowPrivate) {
    const bad = addresses.find((a) => !isPublicAddress(a.address));
    if (bad) return { ok: false, status: null, error: `Refused: ${host} resolves to ${bad.address}, a private, loopback or link-local address.` };
  }
  const pinned = addresses[0];
  const lookup: LookupFunction = (_hostname, options, callback) => {
    if ((options as { all?: boolean }).all) (callback as unknown as (e: null, a: { address: string; family: number }[]) => void)(null, [pinned]);
    else callback(null, pinned.address, pinned.family);
  };
  const timeoutMs = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const cap = opts.maxResponseBytes ?? DEFAULT_MAX_RESPONSE_BYTES;
  const client = url.protocol === 'https:' ? https : http;

  return new Promise<PostOutcome>((resolve) => {
    let settled = false;
    const done = (o: PostOutcome) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      resolve(o);
    };
    const req = client.request(
      url,
      {
        method: 'POST',
        lookup,
        agent: false,
        headers: { ...headers, 'Content-Type': 'application/json', 'Content-Length': String(Buffer.byteLength(body)), 'User-Agent': 'FadeLedger-Webhooks/1' },
      },
      (res) => {
        const status = res.statusCode ?? 0;
        let read = 0;
        res.on('data', (chunk: Buffer) => {
          read += chunk.length;
          // Enough to know the receiver answered; the rest is not ours to download.
          if (read > cap) {
            res.destroy();
            finish();
          }
        });
        const finish = () => {
          if (status >= 200 && status < 300) done({ ok: true, status, error: null });
          else if (status >= 300 && status < 400) done({ ok: false, status, error: `The receiver answered ${status} (a redirect${res.headers.location ? ` to ${String(res.headers.location).slice(0, 200)}` : ''}); redirects are not followed.` });
          else done({ ok: false, status, error: `The receiver answered ${status}.` });
        };
        res.on('end', finish);
        res.on('error', finish);
        res.on('close', finish);
      },
    );
    const timer = setTimeout(() => {
      req.destroy();
      done({ ok: false, status: null, error: `No answer within ${timeoutMs / 1000} s.` });
    }, timeoutMs);
    req.on('error', (e: NodeJS.ErrnoException) => done({ ok: false, status: null, error: `Could not deliver: ${e.code ?? e.message}.` }));
    req.end(body);
  });
}
