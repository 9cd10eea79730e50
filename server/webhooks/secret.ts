import { createCipheriv, createDecipheriv, randomBytes } from 'node:crypto';

/**
 * Endpoint signing secrets: `flwh_` + 32 random bytes (base64url). Shown to the admin once; kept
 * encrypted with AES-256-GCM under WEBHOOK_SECRET_KEY (from the environment), because signing
 * needs the secret itself. Stored as `v1.<iv>.<tag>.<ciphertext>` (base64url), so a later key
 * rotation can tell the versions apart.
 */
export function newWebhookSecret(): string {
  return `flwh_${randomBytes(32).toString('base64url')}`;
}

/** What the list shows of a secret: enough to tell endpoints apart, not to sign. */
export function secretHint(secret: string): string {
  return secret.slice(0, 9);
}

function keyOf(hexKey: string): Buffer {
  const key = Buffer.from(hexKey, 'hex');
  if (key.length !== 32) throw new Error('WEBHOOK_SECRET_KEY must be 32 bytes as 64 hex characters.');
  return key;
}

export function encryptSecret(secret: string, hexKey: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyOf(hexKey), iv);
  const ciphertext = Buffer.concat([cipher.update(secret, 'utf8'), cipher.final()]);
  return ['v1', iv.toString('base64url'), cipher.getAuthTag().toString('base64url'), ciphertext.toString('base64url')].join('.');
}

/** Throws when the stored value was not made with this key (a changed WEBHOOK_SECRET_KEY). */
export function decryptSecret(stored: string, hexKey: string): string {
  const [version, iv, tag, ciphertext] = stored.split('.');
  if (version !== 'v1' || !iv || !tag || !ciphertext) throw new Error('Unknown webhook secret format.');
  const decipher = createDecipheriv('aes-256-gcm', keyOf(hexKey), Buffer.from(iv, 'base64url'));
  decipher.setAuthTag(Buffer.from(tag, 'base64url'));
  return Buffer.concat([decipher.update(Buffer.from(ciphertext, 'base64url')), decipher.final()]).toString('utf8');
}
