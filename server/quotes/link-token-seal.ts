import { openSealedValue, sealValue } from '@/server/crypto/sealed-box';

/**
 * Comparison-link tokens kept so the team can copy a link again, without keeping them readable:
 * AES-256-GCM under SHARE_LINK_KEY (from the environment, never the database). The row's token
 * digest is the additional authenticated data, so a sealed token copied onto another row does not
 * open. Look-ups never use this column: they go by the digest (server/auth/tokens.ts).
 * The sealing itself is server/crypto/sealed-box.ts.
 */

export function linkKeyFrom(value: string): Buffer {
  const key = Buffer.from(value, /[-_]/.test(value) ? 'base64url' : 'base64');
  if (key.length !== 32) throw new Error('SHARE_LINK_KEY must be 32 bytes');
  return key;
}

export function sealLinkToken(token: string, tokenHash: string, key: Buffer): string {
  return sealValue(token, key, tokenHash);
}

/** The token, or null when the value was sealed under another key, for another row, or altered. */
export function openLinkToken(sealed: string, tokenHash: string, key: Buffer): string | null {
  return openSealedValue(sealed, key, tokenHash);
}
