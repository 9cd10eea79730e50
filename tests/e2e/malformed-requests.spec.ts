import { test, expect, type APIRequestContext } from '@playwright/test';
import http from 'node:http';

/**
 * Requests Next.js itself answers 500 get a 4xx from proxy.ts instead: a dynamic segment that
 * does not percent-decode (400), a server action posted from another site (403), an action body
 * over 4 MB, announced or chunked (413), and action bodies React cannot decode (400). A
 * well-formed action still works after all of it.
 */

/** The sign-in action's id, read from the no-JS fallback fields of the sign-in form. */
async function signInActionId(request: APIRequestContext): Promise<string> {
  const html = await (await request.get('/sign-in')).text();
  const m = /name="\$ACTION_1:0" value="\{&quot;id&quot;:&quot;([0-9a-f]+)&quot;/.exec(html);
  if (!m) throw new Error('no action id on /sign-in');
  return m[1];
}

const multipart = (fields: [string, string][], boundary = 'FadeLedgerTest') =>
  fields.map(([k, v]) => `--${boundary}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`).join('') + `--${boundary}--\r\n`;

test('bad percent-encoding in any dynamic segment is 400, not 500', async ({ request }) => {
  for (const path of ['/share/%FF', '/share/%FF/pdf', '/studies/%E0%A4%A', '/quotes/%C0', '/invite/%FF', '/reset-password/%E0%A4%A', '/sign-up/confirm/%FF', '/plans/%FF', '/api/v1/studies/%FF', '/api/v1/quotes/%E0%A4%A/pdf']) {
    const res = await request.get(path, { maxRedirects: 0 });
    expect(res.status(), path).toBe(400);
    if (path.startsWith('/api/')) expect((await res.json()).error.code, path).toBe('bad_request');
  }
  // Valid encodings still reach the page (404 for an unknown token, not 400).
  expect((await request.get('/share/%41%42')).status()).toBe(404);
});

test('server action posts: foreign Origin 403, over 4 MB 413, undecodable 400, a good one still answers', async ({ request, baseURL }) => {
  const id = await signInActionId(request);
  const action = (body: string, headers: Record<string, string> = {}) =>
    request.post('/sign-in', { data: body, headers: { 'next-action': id, origin: baseURL!, 'content-type': 'text/plain;charset=UTF-8', accept: 'text/x-component', ...headers }, maxRedirects: 0 });

  for (const origin of ['https://evil.example', 'null', 'http://localhost.evil.example']) {
    expect((await action('[]', { origin })).status(), origin).toBe(403);
  }
  // The no-JavaScript form post from another site too.
  const mpa = await request.post('/sign-in', {
    data: multipart([[`$ACTION_ID_${id}`, ''], ['email', 'a@b.example'], ['password', 'x']]),
    headers: { origin: 'https://evil.example', 'content-type': 'multipart/form-data; boundary=FadeLedgerTest' },
    maxRedirects: 0,
  });
  expect(mpa.status()).toBe(403);

  expect((await action('["' + 'a'.repeat(4 * 1024 * 1024 + 10) + '"]')).status()).toBe(413);

  for (const [name, body, type] of [
    ['not JSON', '{{{', 'text/plain;charset=UTF-8'],
    ['not an argument list', '{"a":1}', 'text/plain;charset=UTF-8'],
    ['reference to a part never sent', '["$Q5"]', 'text/plain;charset=UTF-8'],
    ['BigInt over 300 digits', `["$n${'9'.repeat(400)}"]`, 'text/plain;charset=UTF-8'],
    ['too many arguments', JSON.stringify(Array(1001).fill(0)), 'text/plain;charset=UTF-8'],
    ['multipart without boundary', 'garbage', 'multipart/form-data'],
    ['broken multipart', '--FadeLedgerTest\r\nbroken', 'multipart/form-data; boundary=FadeLedgerTest'],
    ['multipart without its root part', multipart([['1_email', 'a@b.example']]), 'multipart/form-data; boundary=FadeLedgerTest'],
  ] as const) {
    expect((await action(body, { 'content-type': type })).status(), name).toBe(400);
  }
  expect((await action('[]', { 'next-action': 'not-an-id' })).status()).toBe(400);

  // A well-formed call still reaches the action (a wrong password: the form's own answer, 200).
  const ok = await action(JSON.stringify(['$undefined', { email: 'nobody-here@test.example', password: 'not-it' }]));
  expect(ok.status()).toBe(200);
});

test('a chunked action body over 4 MB is 413 (no Content-Length to go by)', async ({ request, baseURL }) => {
  const id = await signInActionId(request);
  const url = new URL('/sign-in', baseURL);
  const status = await new Promise<number>((resolve, reject) => {
    const req = http.request(
      { host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers: { 'next-action': id, origin: url.origin, 'content-type': 'text/plain;charset=UTF-8', 'transfer-encoding': 'chunked' } },
      (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
      },
    );
    req.on('error', (e) => ((e as NodeJS.ErrnoException).code === 'EPIPE' || (e as NodeJS.ErrnoException).code === 'ECONNRESET' ? undefined : reject(e)));
    const chunk = Buffer.alloc(64 * 1024, 0x61);
    req.write('["');
    let sent = 0;
    const pump = () => {
      while (sent < 6 * 1024 * 1024) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
      req.end('"]');
    };
    pump();
  });
  expect(status).toBe(413);
});
