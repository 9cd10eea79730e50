import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { isPublicAddress } from '@/server/webhooks/address-check';
import { decryptSecret, encryptSecret, newWebhookSecret } from '@/server/webhooks/secret';
import { signatureHeader, verifySignature } from '@/server/webhooks/signature';
import { urlRefusal } from '@/server/webhooks/safe-post';
import { buildOpenApiDocument } from '@/server/api/openapi/document';

describe('webhook addresses', () => {
  // Ranges: IANA IPv4/IPv6 Special-Purpose Address Registries (RFC 6890), from memory.
  it.each([
    ['127.0.0.1', false], ['10.1.2.3', false], ['172.16.0.1', false], ['172.31.255.255', false], ['192.168.1.1', false], ['169.254.169.254', false],
    ['100.64.0.1', false], ['0.0.0.0', false], ['224.0.0.1', false], ['192.0.2.10', false], ['::1', false], ['::', false], ['fe80::1', false],
    ['fd00:ec2::254', false], ['::ffff:127.0.0.1', false], ['::ffff:7f00:1', false], ['::ffff:10.0.0.1', false], ['not-an-ip', false],
    ['172.32.0.1', true], ['8.8.8.8', true], ['1.1.1.1', true], ['2a00:1450:4001:80b::200e', true], ['::ffff:8.8.8.8', true],
  ])('%s public: %s', (address, expected) => {
    expect(isPublicAddress(address)).toBe(expected);
  });

  it('refuses http, credentials, local names and private literals unless allowed for local testing', () => {
    expect(urlRefusal('http://hooks.example.com/x', false)).toMatch(/https/);
    expect(urlRefusal('http://127.0.0.1:9/x', true)).toBeNull();
    expect(urlRefusal('https://user:pw@hooks.example.com/x', false)).toMatch(/passwords/);
    expect(urlRefusal('https://localhost/x', false)).toMatch(/local/);
    expect(urlRefusal('https://[::1]/x', false)).toMatch(/private/);
    expect(urlRefusal('https://10.0.0.2/x', false)).toMatch(/private/);
    expect(urlRefusal('ftp://hooks.example.com/x', true)).toMatch(/https/);
    expect(urlRefusal('https://hooks.example.com/fadeledger', false)).toBeNull();
  });
});

describe('signing secrets at rest', () => {
  it('round-trips under the key and fails under another', () => {
    const key = randomBytes(32).toString('hex');
    const secret = newWebhookSecret();
    const stored = encryptSecret(secret, key);
    expect(stored).not.toContain(secret.slice(5));
    expect(decryptSecret(stored, key)).toBe(secret);
    expect(() => decryptSecret(stored, randomBytes(32).toString('hex'))).toThrow();
  });
});

describe('the documented signature', () => {
  it('the verification example in the API reference accepts our header and refuses a changed body', () => {
    const intro = (buildOpenApiDocument('http://localhost:3000') as { info: { description: string } }).info.description;
    const code = /```js\n([\s\S]*?)```/.exec(intro)?.[1];
    expect(code).toBeTruthy();
    const verify = new Function('require', `${code}; return verify;`)(require) as (secret: string, header: string, raw: string) => boolean;
    const secret = newWebhookSecret();
    const body = JSON.stringify({ id: 'evt_1', type: 'quote.accepted', data: { quote: { id: 7 } } });
    const header = signatureHeader(secret, Math.floor(Date.now() / 1000), body);
    expect(verify(secret, header, body)).toBe(true);
    expect(verify(secret, header, body.replace('7', '8'))).toBe(false);
    expect(verifySignature(secret, header, body)).toBe(true);
    // An old timestamp is a replay.
    const old = signatureHeader(secret, Math.floor(Date.now() / 1000) - 3600, body);
    expect(verify(secret, old, body)).toBe(false);
    expect(verifySignature(secret, old, body)).toBe(false);
  });
});
