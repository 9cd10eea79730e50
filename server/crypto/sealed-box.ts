import { createCipheriv, createDecipheriv, randomBytes } from 'node:crypto';

/**
 * A secret kept in the database but readable only with a key from the environment: AES-256-GCM with
 * a fresh 12-byte IV per value (NIST SP 800-38D), optional additional authenticated data binding the
 * value to its row. Stored as "v1.<iv>.<ciphertext>.<tag>", each part base64url; the version lets a
 * later key rotation tell formats apart. Used for comparison-link tokens and webhook signing secrets.
 */
const VERSION = 'v1';

/** Seals `plain` under the 32-byte `key`; `aad` (e.g. the row's token digest) must be given again to open it. */
export function sealValue(plain: string, key: Buffer, aad?: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', key, iv);
  if (aad !== undefined) cipher.setAAD(Buffer.from(aad, 'utf8'));
  const sealed = Buffer.concat([cipher.update(plain, 'utf8'), cipher.final()]);
  return [VERSION, iv.toString('base64url'), sealed.toString('base64url'), cipher.getAuthTag().toString('base64url')].join('.');
}

/** The value, or null when it was sealed under another key, with other `aad`, or altered. */
export function openSealedValue(stored: string, key: Buffer, aad?: string): string | null {
  const [version, iv, body, tag] = stored.split('.');
  if (version !== VERSION || !iv || !body || !tag) return null;
  try {
    const decipher = createDecipheriv('aes-256-gcm', key, Buffer.from(iv, 'base64url'));
    if (aad !== undefined) decipher.setAAD(Buffer.from(aad, 'utf8'));
    decipher.setAuthTag(Buffer.from(tag, 'base64url'));
    return Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]).toString('utf8');
  } catch {
    return null;
  }
}
