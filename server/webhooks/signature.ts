import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * How a delivery is signed (documented in DEVELOPERS.md and on settings/webhooks):
 *
 *   FadeLedger-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256(secret, `${t}.${body}`)>
 *
 * `body` is the raw request body exactly as received. The timestamp is inside the signed text, so
 * a receiver that refuses old timestamps (we suggest 5 minutes) also refuses replays.
 */
export const SIGNATURE_HEADER = 'FadeLedger-Signature';
export const DEFAULT_TOLERANCE_SECONDS = 300;

export function signatureOf(secret: string, timestampSeconds: number, body: string): string {
  return createHmac('sha256', secret).update(`${timestampSeconds}.${body}`, 'utf8').digest('hex');
}

export function signatureHeader(secret: string, timestampSeconds: number, body: string): string {
  return `t=${timestampSeconds},v1=${signatureOf(secret, timestampSeconds, body)}`;
}

/**
 * What a receiver does (and what our tests do): parse the header, recompute, compare in constant
 * time, refuse a timestamp outside the tolerance.
 */
export function verifySignature(secret: string, header: string | null | undefined, body: string, nowSeconds = Math.floor(Date.now() / 1000), toleranceSeconds = DEFAULT_TOLERANCE_SECONDS): boolean {
  if (!header) return false;
  const parts = new Map(header.split(',').map((p) => p.trim().split('=', 2) as [string, string]));
  const t = Number(parts.get('t'));
  const v1 = parts.get('v1') ?? '';
  if (!Number.isInteger(t) || !/^[0-9a-f]{64}$/.test(v1)) return false;
  if (Math.abs(nowSeconds - t) > toleranceSeconds) return false;
  return timingSafeEqual(Buffer.from(v1, 'hex'), Buffer.from(signatureOf(secret, t, body), 'hex'));
}
