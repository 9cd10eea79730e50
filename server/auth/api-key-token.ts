import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

/**
 * API key strings: `fl_` + 32 random bytes in base64url (46 characters, 256 bits of entropy, so a
 * plain sha256 digest is enough to store; no slow hash is needed). The first 11 characters are the
 * visible prefix: shown in lists and used to find the row, never enough to use the key.
 */
export const API_KEY_PREFIX_LENGTH = 11;
const API_KEY_PATTERN = /^fl_[A-Za-z0-9_-]{43}$/;

export function newApiKeyToken(): string {
  return `fl_${randomBytes(32).toString('base64url')}`;
}

export function apiKeyPrefix(token: string): string {
  return token.slice(0, API_KEY_PREFIX_LENGTH);
}

export function hashApiKey(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** The exact shape of our keys; anything else is refused before the database is asked. */
export function looksLikeApiKey(value: string): boolean {
  return API_KEY_PATTERN.test(value);
}

/** sha256 hex digests compared without an early exit. */
export function sameDigest(aHex: string, bHex: string): boolean {
  const a = Buffer.from(aHex, 'hex');
  const b = Buffer.from(bHex, 'hex');
  return a.length === 32 && b.length === 32 && timingSafeEqual(a, b);
}

/**
 * The key of an `Authorization: Bearer <key>` header: null when the request has no Authorization
 * header (it may then use a session), '' when the header is there but is not a bearer credential.
 */
export function bearerTokenOf(headers: Headers): string | null {
  const value = headers.get('authorization');
  if (value === null) return null;
  const m = /^Bearer[ ]+([^\s]+)[ ]*$/i.exec(value);
  return m ? m[1] : '';
}
