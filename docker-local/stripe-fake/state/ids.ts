// Stripe-like object ids: a type prefix and random base62, unguessable so that hosted page
// URLs (checkout, portal) work as bearer links the way Stripe's do.
import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

export function randomToken(length: number): string {
  const bytes = randomBytes(length * 2);
  let out = '';
  for (let i = 0; out.length < length && i < bytes.length; i++) {
    // Rejection sampling keeps every character equally likely (248 = 4 * 62).
    if (bytes[i] < 248) out += ALPHABET[bytes[i] % 62];
  }
  return out.length === length ? out : out + randomToken(length - out.length);
}

const LENGTHS: Record<string, number> = {
  cus: 14,
  prod: 14,
  price: 24,
  cs_test: 58,
  sub: 24,
  si: 14,
  in: 24,
  il: 24,
  li: 24,
  evt: 24,
  bps: 24,
  req: 14,
};

export function newId(prefix: keyof typeof LENGTHS): string {
  return `${prefix}_${randomToken(LENGTHS[prefix])}`;
}

export function nowSeconds(): number {
  return Math.floor(Date.now() / 1000);
}
