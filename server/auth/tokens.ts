import { createHash, randomBytes } from 'node:crypto';

/**
 * Link tokens (invitations, password resets) and session ids: 32 random bytes, base64url.
 * Only the sha256 digest is stored, so the database alone cannot open an account; lookups go by
 * digest, which also keeps the comparison off any early-exit string compare.
 */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Tokens are 43 base64url characters; anything else is rejected before touching the database. */
export function looksLikeToken(value: unknown): value is string {
  return typeof value === 'string' && /^[A-Za-z0-9_-]{20,128}$/.test(value);
}
