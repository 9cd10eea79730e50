import { asUser, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import net from 'node:net';
import { NextRequest } from 'next/server';

/**
 * While MariaDB cannot be reached: pages answer 503 with Retry-After and a page that says so
 * (proxy.ts), the API answers 503 JSON with Retry-After (apiRoute), a server action answers its
 * form with code 'unavailable' (safeAction), health stays 503; once it is back, all of them work
 * again through the same pool, without a restart.
 *
 * The app reaches the real test database through a forwarder of this file's own: closing it
 * (and cutting its open connections) is the database going away for this process only, so no
 * other test or engineer sharing the server notices.
 */
const target = { host: process.env.DATABASE_HOST ?? '127.0.0.1', port: Number(process.env.DATABASE_PORT) };
const open = new Set<net.Socket>();
let server: net.Server | null = null;
let port = 0;

function startForwarder(): Promise<void> {
  server = net.createServer((client) => {
    const upstream = net.connect(target.port, target.host);
    for (const s of [client, upstream]) {
      open.add(s);
      s.on('close', () => open.delete(s));
      s.on('error', () => undefined);
    }
    client.pipe(upstream).pipe(client);
  });
  return new Promise((resolve) => server!.listen(port, '127.0.0.1', () => {
    port = (server!.address() as net.AddressInfo).port;
    resolve();
  }));
}

async function stopForwarder(): Promise<void> {
  for (const s of open) s.destroy();
  await new Promise((resolve) => server!.close(resolve));
  server = null;
}

let proxy: (req: NextRequest) => Promise<Response>;
let me: (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
let health: () => Promise<Response>;
let signIn: typeof import('@/server/actions/auth').signIn;
const page = (path: string) => new NextRequest(new URL(path, process.env.APP_URL), { headers: { accept: 'text/html' } });
const apiCall = () => me(new Request(new URL('/api/v1/me', process.env.APP_URL), { headers: { cookie: 'fl_session=' + 'x'.repeat(43) } }), { params: Promise.resolve({}) });
const passedThrough = (res: Response) => res.headers.get('x-middleware-next') === '1';

beforeAll(async () => {
  await startForwarder();
  process.env.DATABASE_PORT = String(port);
  ({ proxy } = await import('@/proxy'));
  ({ GET: me } = (await import('@/app/api/v1/me/route')) as unknown as { GET: typeof me });
  ({ GET: health } = await import('@/app/api/health/route'));
  ({ signIn } = await import('@/server/actions/auth'));
});
beforeEach(() => {
  setRequestHeaders({});
  asUser('x'.repeat(43)); // an unknown session token: the guard must ask the database about it
});

afterAll(async () => {
  const { closeSequelize } = await import('@/db/sequelize');
  await closeSequelize().catch(() => undefined);
  if (server) await stopForwarder();
});

describe('MariaDB out of reach', () => {
  it('with the database up, pages pass the proxy and the API answers as usual', async () => {
    expect(passedThrough(await proxy(page('/dashboard')))).toBe(true);
    expect((await apiCall()).status).toBe(401);
    expect((await health()).status).toBe(200);
  });

  it('answers 503 with Retry-After on pages and the API, a friendly form answer for actions, then recovers', async () => {
    await stopForwarder();

    for (const path of ['/dashboard', '/studies/12', '/share/' + 'a'.repeat(43), '/sign-in']) {
      const res = await proxy(page(path));
      expect(res.status, path).toBe(503);
      expect(Number(res.headers.get('retry-after')), path).toBeGreaterThan(0);
      expect(res.headers.get('content-type')).toMatch(/^text\/html/);
      const html = await res.text();
      expect(html).toContain('briefly unavailable');
      expect(html).not.toMatch(/<script/i);
      // The security headers are on this answer too.
      expect(res.headers.get('x-frame-options')).toBe('DENY');
    }

    const api = await apiCall();
    expect(api.status).toBe(503);
    expect(Number(api.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await api.json()).toEqual({ error: { code: 'unavailable', message: expect.stringMatching(/briefly unavailable/) } });
    // The proxy leaves /api to answer for itself (it only adds headers).
    expect(passedThrough(await proxy(page('/api/v1/me')))).toBe(true);

    const action = await callAction(signIn, { email: 'someone@test.example', password: 'whatever-it-is' });
    expect(action.state).toMatchObject({ ok: false, code: 'unavailable', error: expect.stringMatching(/briefly unavailable/) });

    expect((await health()).status).toBe(503);

    await startForwarder();
    let recovered = false;
    for (let i = 0; i < 40 && !recovered; i++) {
      recovered = passedThrough(await proxy(page('/dashboard'))) && (await apiCall()).status === 401;
      if (!recovered) await new Promise((r) => setTimeout(r, 250));
    }
    expect(recovered).toBe(true);
    expect((await health()).status).toBe(200);
  }, 60_000);
});
