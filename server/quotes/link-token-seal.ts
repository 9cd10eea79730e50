import { createCipheriv, createDecipheriv, randomBytes } from 'node:crypto';

/**
 * Comparison-link tokens kept so the team can copy a link again, without keeping them readable:
 * AES-256-GCM under SHARE_LINK_KEY (from the environment, never the database). The row's token
 * digest is the additional authenticated data, so a sealed token copied onto another row does not
 * open. Look-ups never use this column: they go by the digest (server/auth/tokens.ts).
 *
 * Stored form: "v1.<iv>.<ciphertext>.<tag>", each part base64url (12-byte IV per NIST SP 800-38D).
 */
const VERSION = 'v1';

export function linkKeyFrom(value: string): Buffer {
  const key = Buffer.from(value, /[-_]/.test(value) ? 'base64url' : 'base64');
  if (key.length !== 32) throw new Error('SHARE_LINK_KEY must be 32 bytes');
  return key;
}

export function sealLinkToken(token: string, tokenHash: string, key: Buffer): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', key, iv);
  cipher.setAAD(Buffer.from(tokenHash, 'utf8'));
  const sealed = Buffer.concat([cipher.update(token, 'utf8'), cipher.final()]);
  return [VERSION, iv.toString('base64url'), sealed.toString('base64url'), cipher.getAuthTag().toString('base64url')].join('.');
}

/** The token, or null when the value was sealed under another key, for another row, or altered. */
export function openLinkToken(sealed: string, tokenHash: string, key: Buffer): string | null {
  const [version, iv, body, tag] = sealed.split('.');
  if (version !== VERSION || !iv || !body || !tag) return null;
  try {
    const decipher = createDecipheriv('aes-256-gcm', key, Buffer.from(iv, 'base64url'));
    decipher.setAAD(Buffer.from(tokenHash, 'utf8'));
    decipher.setAuthTag(Buffer.from(tag, 'base64url'));
    return Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]).toString('utf8');
  } catch {
    return null;
  }
}
