import { describe, expect, it } from 'vitest';
import { ACTION_BODY_LIMIT_BYTES, badPercentEncoding, checkActionBody, foreignOrigin, looksLikeAction } from '@/server/http/request-checks';

const ID = 'ab'.repeat(21);
const action = (body: BodyInit, headers: Record<string, string> = {}) =>
  new Request('http://localhost:3100/sign-in', { method: 'POST', headers: { 'next-action': ID, 'content-type': 'text/plain;charset=UTF-8', ...headers }, body, duplex: 'half' } as RequestInit);
const multipart = (fields: [string, string][], boundary = 'B0und') =>
  fields.map(([k, v]) => `--${boundary}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`).join('') + `--${boundary}--\r\n`;
const MP = { 'content-type': 'multipart/form-data; boundary=B0und' };

describe('badPercentEncoding', () => {
  it('finds a segment that does not decode as UTF-8', () => {
    for (const p of ['/share/%FF', '/studies/%E0%A4%A', '/a/%', '/a/%zz/b', '/api/v1/quotes/%C0/pdf']) expect(badPercentEncoding(p), p).toBe(true);
  });
  it('passes plain and well-encoded paths', () => {
    for (const p of ['/', '/share/AbC_-12', '/studies/%E0%A4%A4', '/sites/caf%C3%A9', '/a%20b']) expect(badPercentEncoding(p), p).toBe(false);
  });
});

describe('foreignOrigin', () => {
  const ours = ['localhost:3100'];
  it('accepts our own origin and a missing one (not a browser carrying cookies)', () => {
    expect(foreignOrigin('http://localhost:3100', ours)).toBe(false);
    expect(foreignOrigin(null, ours)).toBe(false);
  });
  it('refuses other hosts, other ports, look-alikes, "null" and junk', () => {
    for (const o of ['https://evil.example', 'http://localhost:3101', 'http://localhost:3100.evil.example', 'null', 'not a url']) expect(foreignOrigin(o, ours), o).toBe(true);
  });
});

describe('looksLikeAction', () => {
  it('is the fetch form (Next-Action header) or a multipart form post', () => {
    expect(looksLikeAction(action('[]'))).toBe(true);
    expect(looksLikeAction(new Request('http://x/', { method: 'POST', headers: MP, body: multipart([]) }))).toBe(true);
    expect(looksLikeAction(new Request('http://x/', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' }))).toBe(false);
  });
});

describe('checkActionBody', () => {
  it('lets a well-formed call through (text and multipart, with a FormData argument and outlined parts)', async () => {
    expect(await checkActionBody(action(JSON.stringify(['$undefined', { email: 'a@b.example', when: '$D2026-01-01T00:00:00.000Z', n: '$n12' }])))).toBeNull();
    expect(await checkActionBody(action(multipart([['0', '["$undefined","$K1","$Q2"]'], ['1_email', 'a@b.example'], ['2', '[]']]), MP))).toBeNull();
    expect(await checkActionBody(action(JSON.stringify(['$$dollar text'])))).toBeNull();
  });

  it('refuses what React cannot decode with 400', async () => {
    const bad: [string, Request][] = [
      ['not JSON', action('{{{')],
      ['not an argument list', action('{"a":1}')],
      ['a part that was never sent', action('["$Q5"]')],
      ['a promise of a missing part', action('["$@3"]')],
      ['an outlined model that is missing', action('["$1"]')],
      ['a BigInt over 300 digits', action(`["$n${'9'.repeat(301)}"]`)],
      ['over 1000 arguments', action(JSON.stringify(Array(1001).fill(0)))],
      ['a multipart body without boundary', action('x', { 'content-type': 'multipart/form-data' })],
      ['a broken multipart body', action('--B0und\r\nbroken', MP)],
      ['a multipart body without its root', action(multipart([['1_a', 'b']]), MP)],
      ['a multipart root that is not JSON', action(multipart([['0', '[{']]), MP)],
      ['an action id that is not hex', action('[]', { 'next-action': 'x;y' })],
    ];
    for (const [name, req] of bad) expect((await checkActionBody(req))?.status, name).toBe(400);
  });

  it('refuses a body over 4 MB with 413, announced or streamed without a length', async () => {
    expect((await checkActionBody(action('[]', { 'content-length': String(ACTION_BODY_LIMIT_BYTES + 1) })))?.status).toBe(413);
    let pulled = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x61);
    const stream = new ReadableStream<Uint8Array>({
      pull(c) {
        pulled += chunk.byteLength;
        if (pulled > 50 * 1024 * 1024) return c.close();
        c.enqueue(chunk);
      },
    });
    expect((await checkActionBody(action(stream)))?.status).toBe(413);
    expect(pulled).toBeLessThan(ACTION_BODY_LIMIT_BYTES + 4 * chunk.byteLength);
  });

  it('leaves a multipart post without Next-Action to Next (its own $ACTION field checks)', async () => {
    const req = new Request('http://x/sign-in', { method: 'POST', headers: MP, body: multipart([['$ACTION_ID_' + ID, ''], ['email', 'a@b.example']]) });
    expect(await checkActionBody(req)).toBeNull();
  });
});
