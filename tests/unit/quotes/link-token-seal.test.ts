import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { hashToken, newToken } from '@/server/auth/tokens';
import { linkKeyFrom, openLinkToken, sealLinkToken } from '@/server/quotes/link-token-seal';

const key = randomBytes(32);

describe('sealed link tokens (AES-256-GCM)', () => {
  it('opens what it sealed, and the sealed form does not contain the token', () => {
    const token = newToken();
    const sealed = sealLinkToken(token, hashToken(token), key);
    expect(sealed).not.toContain(token);
    expect(sealed.startsWith('v1.')).toBe(true);
    expect(openLinkToken(sealed, hashToken(token), key)).toBe(token);
    // A fresh IV each time: the same token never seals to the same text.
    expect(sealLinkToken(token, hashToken(token), key)).not.toBe(sealed);
  });

  it('refuses another key, another row’s digest, and any altered byte', () => {
    const token = newToken();
    const sealed = sealLinkToken(token, hashToken(token), key);
    expect(openLinkToken(sealed, hashToken(token), randomBytes(32))).toBeNull();
    expect(openLinkToken(sealed, hashToken(newToken()), key)).toBeNull();
    const [v, iv, body, tag] = sealed.split('.');
    const flipped = Buffer.from(body, 'base64url');
    flipped[0] ^= 1;
    expect(openLinkToken([v, iv, flipped.toString('base64url'), tag].join('.'), hashToken(token), key)).toBeNull();
    expect(openLinkToken('v2.a.b.c', hashToken(token), key)).toBeNull();
    expect(openLinkToken('garbage', hashToken(token), key)).toBeNull();
  });

  it('takes the key as 32 bytes of base64 or base64url, nothing shorter', () => {
    expect(linkKeyFrom(key.toString('base64')).equals(key)).toBe(true);
    expect(linkKeyFrom(key.toString('base64url')).equals(key)).toBe(true);
    expect(() => linkKeyFrom(randomBytes(16).toString('base64'))).toThrow(/32 bytes/);
  });
});
