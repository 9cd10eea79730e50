import { randomBytes } from 'node:crypto';
import { openSealedValue, sealValue } from '@/server/crypto/sealed-box';

/**
 * Endpoint signing secrets: `flwh_` + 32 random bytes (base64url). Shown to the admin once; kept
 * encrypted with AES-256-GCM under WEBHOOK_SECRET_KEY (from the environment), because signing
 * needs the secret itself (server/crypto/sealed-box.ts).
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
  return sealValue(secret, keyOf(hexKey));
}

/** Throws when the stored value was not made with this key (a changed WEBHOOK_SECRET_KEY). */
export function decryptSecret(stored: string, hexKey: string): string {
  const secret = openSealedValue(stored, keyOf(hexKey));
  if (secret === null) throw new Error('The webhook secret cannot be read with this WEBHOOK_SECRET_KEY (changed key or altered value).');
  return secret;
}
