import { asSignedOut } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { API_SCOPES, type ApiScope } from '@/server/auth/api-scopes';
import { API_OPERATIONS } from '@/server/api/openapi/operations';
import { callAction } from './support/next-request';
import { revokeApiKey } from '@/server/actions/api-keys';
import { createCompany, createUserWithRole, signInAs, type TestUser } from './support/factories';
import { keyRequest, makeKey } from './support/api-keys';
import { draftQuote, testStudy } from './quotes-fixtures';
import { asUser } from './support/next-request';

/**
 * Every /api/v1 route (found by globbing app/api/v1) called with API keys: a key of each single
 * scope and one with all of them. A route answers a key whose scope opens it (and its JSON matches
 * the OpenAPI document's answer schema), refuses every other key with 403 `forbidden`, and after
 * revocation refuses every key with 401. Expected scopes are written out here, not read from the
 * scope table, so a change to either shows up.
 */
type RouteModule = Record<string, unknown>;
type Handler = (req: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
type World = { studyId: number; quoteId: number; uploadId: number; otherStudyId: number };
type Call = { url: string; params?: Record<string, string>; json?: unknown };

const EXPECTED: Record<string, { scope: ApiScope | 'any' | 'public'; call: (w: World) => Call }> = {
  'GET /api/v1/me': { scope: 'any', call: () => ({ url: '/api/v1/me' }) },
  'GET /api/v1/openapi.json': { scope: 'public', call: () => ({ url: '/api/v1/openapi.json' }) },
  // The document's own example body: the reference's example runs.
  'POST /api/v1/tradeoff': { scope: 'trade-off', call: () => ({ url: '/api/v1/tradeoff', json: documented('POST /api/v1/tradeoff')!.bodyExample }) },
  'GET /api/v1/studies': { scope: 'studies', call: () => ({ url: '/api/v1/studies?pageSize=5' }) },
  'GET /api/v1/studies/[id]': { scope: 'studies', call: (w) => ({ url: `/api/v1/studies/${w.studyId}`, params: { id: String(w.studyId) } }) },
  'GET /api/v1/dashboard': { scope: 'studies', call: () => ({ url: '/api/v1/dashboard' }) },
  'GET /api/v1/quotes': { scope: 'quotes', call: () => ({ url: '/api/v1/quotes?status=all' }) },
  'GET /api/v1/quotes/[id]': { scope: 'quotes', call: (w) => ({ url: `/api/v1/quotes/${w.quoteId}`, params: { id: String(w.quoteId) } }) },
  'GET /api/v1/quotes/[id]/pdf': { scope: 'quotes', call: (w) => ({ url: `/api/v1/quotes/${w.quoteId}/pdf`, params: { id: String(w.quoteId) } }) },
  'GET /api/v1/branding/logo': { scope: 'quotes', call: () => ({ url: '/api/v1/branding/logo' }) },
  'GET /api/v1/customers': { scope: 'read', call: () => ({ url: '/api/v1/customers' }) },
  'GET /api/v1/sites': { scope: 'read', call: () => ({ url: '/api/v1/sites?q=' }) },
  'GET /api/v1/team': { scope: 'read', call: () => ({ url: '/api/v1/team' }) },
  'GET /api/v1/uploads/[id]': { scope: 'read', call: (w) => ({ url: `/api/v1/uploads/${w.uploadId}`, params: { id: String(w.uploadId) } }) },
};


const modules = import.meta.glob<RouteModule>('/app/api/v1/**/route.ts');
const ROUTES: { name: string; handler: Handler }[] = [];
for (const [path, load] of Object.entries(modules)) {
  const pattern = path.replace(/^\/app/, '').replace(/\/route\.ts$/, '');
  const mod = await load();
  for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']) if (typeof mod[method] === 'function') ROUTES.push({ name: `${method} ${pattern}`, handler: mod[method] as Handler });
}
const documented = (name: string) => API_OPERATIONS.find((o) => `${o.method.toUpperCase()} ${o.route}` === name);

let world: World;
let admin: TestUser;
let adminSession: string;
const keys = {} as Record<ApiScope | 'all', string>;

beforeAll(async () => {
  const company = await createCompany({ planCode: 'fleet' });
  admin = await createUserWithRole(company.id, 'admin');
  adminSession = await signInAs(admin);
  const other = await createCompany({ planCode: 'fleet' });
  const otherAdmin = await createUserWithRole(other.id, 'admin');
  const { quoteId, studyId } = await draftQuote(admin);
  const upload = await models().Upload.create({
    companyId: company.id,
    kind: 'dish-catalogue',
    originalFilename: 'dishes.csv',
    originalBytes: Buffer.from('name,diameter_m\nTest dish,0.8\n'),
    sizeBytes: 31,
    parseReport: { kind: 'dish-catalogue', summary: 'key test upload', rowCount: 1 },
    createdByUserId: null,
  });
  world = { studyId, quoteId, uploadId: upload.id, otherStudyId: await testStudy(otherAdmin) };
  for (const scope of API_SCOPES) keys[scope] = (await makeKey(adminSession, [scope])).token;
  keys.all = (await makeKey(adminSession, API_SCOPES)).token;
}, 120_000);
afterAll(closeSequelize);

async function callWith(token: string, route: { name: string; handler: Handler }): Promise<Response> {
  asSignedOut();
  const c = EXPECTED[route.name].call(world);
  const method = route.name.split(' ')[0];
  return route.handler(keyRequest(token, c.url, { method, json: c.json }), { params: Promise.resolve(c.params ?? {}) });
}

describe('API keys on every /api/v1 route', () => {
  it('every route file has an expected scope here (and no stale rows)', () => {
    expect(ROUTES.length).toBeGreaterThanOrEqual(14);
    expect(ROUTES.map((r) => r.name).sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  describe.each(ROUTES.map((r) => [r.name, r] as const))('%s', (name, route) => {
    const expected = EXPECTED[name];
    const holders = [...API_SCOPES, 'all'] as const;
    it.each(holders.map((h) => [h, expected.scope === 'any' || expected.scope === 'public' || h === 'all' || h === expected.scope] as const))('key with scope %s: allowed %s', async (holder, allowed) => {
      const res = await callWith(keys[holder], route);
      if (!allowed) {
        expect(res.status).toBe(403);
        expect(((await res.json()) as { error: { code: string } }).error.code).toBe('forbidden');
        return;
      }
      expect(res.status, await res.clone().text()).toBe(name === 'GET /api/v1/branding/logo' ? 404 : 200);
      const op = documented(name);
      if (res.status === 200 && op && 'json' in op.response) {
        const parsed = op.response.json.safeParse(await res.json());
        expect(parsed.success, parsed.success ? '' : z.prettifyError(parsed.error)).toBe(true);
      }
      if (res.status === 200 && op && 'file' in op.response && op.response.file !== 'image/png') expect(res.headers.get('content-type')).toContain(op.response.file);
    });
  });

  it('another company’s study by id answers 404 to a key', async () => {
    const route = ROUTES.find((r) => r.name === 'GET /api/v1/studies/[id]')!;
    asSignedOut();
    const res = await route.handler(keyRequest(keys.all, `/api/v1/studies/${world.otherStudyId}`), { params: Promise.resolve({ id: String(world.otherStudyId) }) });
    expect(res.status).toBe(404);
  });

  it('after revocation every route refuses the key with 401 (the public document still answers)', async () => {
    const { token } = await makeKey(adminSession, API_SCOPES, { name: 'Soon revoked' });
    const me = ROUTES.find((r) => r.name === 'GET /api/v1/me')!;
    expect((await callWith(token, me)).status).toBe(200);
    const row = await models().ApiKey.findOne({ where: { companyId: admin.companyId!, name: 'Soon revoked' } });
    asUser(adminSession);
    const out = await callAction(revokeApiKey, { id: String(row!.id) });
    expect(out.state?.ok).toBe(true);
    for (const route of ROUTES) {
      const res = await callWith(token, route);
      if (EXPECTED[route.name].scope === 'public') expect(res.status, route.name).toBe(200);
      else {
        expect(res.status, route.name).toBe(401);
        expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/revoked/);
      }
    }
  });
});
