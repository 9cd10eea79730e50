// A load balancer of ours would set X-Forwarded-For: the last-used address is then known.
process.env.TRUST_PROXY = 'true';
import { apiRequest, asSignedOut, asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { GET as meRoute } from '@/app/api/v1/me/route';
import { GET as studiesRoute } from '@/app/api/v1/studies/route';
import { POST as tradeoffRoute } from '@/app/api/v1/tradeoff/route';
import { createApiKey, revokeApiKey } from '@/server/actions/api-keys';
import { hashApiKey } from '@/server/auth/api-key-token';
import { MAX_LIVE_API_KEYS } from '@/server/auth/api-key-admin';
import { createCompany, createUserWithRole, signInAs, type TestUser } from './support/factories';
import { keyRequest, makeKey } from './support/api-keys';

/**
 * API keys end to end on the real MariaDB: made by an admin (shown once, stored hashed), refused
 * by plan, revoked across companies as a 404, last use recorded, the per-minute window exact under
 * 20 parallel requests, the bearer header taking precedence over any cookie.
 */
const noParams = { params: Promise.resolve({}) };
let company: { id: number };
let admin: TestUser;
let adminSession: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  admin = await createUserWithRole(company.id, 'admin');
  adminSession = await signInAs(admin);
});
afterAll(async () => {
  delete process.env.TRUST_PROXY;
  await closeSequelize();
});

const me = (token: string, headers: Record<string, string> = {}) => meRoute(keyRequest(token, '/api/v1/me', { headers }), noParams);

describe('making a key', () => {
  it('returns the key once; the database holds only its sha256 and the visible prefix', async () => {
    asUser(adminSession);
    const out = await callAction(createApiKey, { name: 'Order system', scopes: ['studies', 'quotes'], rateLimitPerMinute: '90' });
    expect(out.state?.ok, JSON.stringify(out.state)).toBe(true);
    const { token, prefix } = (out.state as { data: { token: string; prefix: string } }).data;
    expect(token).toMatch(/^fl_[A-Za-z0-9_-]{43}$/);
    expect(token.startsWith(prefix)).toBe(true);
    const row = await models().ApiKey.findOne({ where: { companyId: company.id, name: 'Order system' } });
    expect(row!.tokenHash).toBe(hashApiKey(token));
    expect(row!.prefix).toBe(prefix);
    expect(row!.scopes).toBe('studies,quotes');
    expect(row!.rateLimitPerMinute).toBe(90);
    const [dump] = await models().sequelize.query<Record<string, unknown>>('SELECT * FROM api_keys WHERE id = :id', { replacements: { id: row!.id }, type: QueryTypes.SELECT });
    expect(JSON.stringify(dump)).not.toContain(token.slice(API_PREFIX_VISIBLE));
    const [event] = await models().sequelize.query<{ action: string; target_label: string }>("SELECT action, target_label FROM audit_events WHERE company_id = :c AND action = 'api_key.created'", { replacements: { c: company.id }, type: QueryTypes.SELECT });
    expect(event.target_label).toContain('Order system');
  });

  it('refuses a key without a scope or a name, naming the fields', async () => {
    asUser(adminSession);
    const out = await callAction(createApiKey, { name: ' ', rateLimitPerMinute: '10' });
    expect(out.state?.ok).toBe(false);
    expect(Object.keys((out.state as { fieldErrors: Record<string, string[]> }).fieldErrors).sort()).toEqual(['name', 'scopes']);
  });

  it('is refused on a plan without API access (plan_limit), and the plan refuses existing keys with 403', async () => {
    const crew = await createCompany({ planCode: 'crew' });
    asUser(await signInAs(await createUserWithRole(crew.id, 'admin')));
    const out = await callAction(createApiKey, { name: 'Not on crew', scopes: ['read'] });
    expect(out.state?.ok).toBe(false);
    expect((out.state as { code: string }).code).toBe('plan_limit');

    // A fleet company with a key moves to crew: the key is refused with a message naming the plan.
    const moving = await createCompany({ planCode: 'fleet' });
    const { token } = await makeKey(await signInAs(await createUserWithRole(moving.id, 'admin')), ['read']);
    expect((await me(token)).status).toBe(200);
    const crewPlan = await models().Plan.findOne({ where: { code: 'crew' } });
    await models().Company.update({ planId: crewPlan!.id }, { where: { id: moving.id } });
    const res = await me(token);
    expect(res.status).toBe(403);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe('plan_limit');
    expect(body.error.message).toMatch(/API access is not part of the Crew plan/);
  });

  it(`holds at most ${MAX_LIVE_API_KEYS} live keys per company`, async () => {
    const busy = await createCompany({ planCode: 'fleet' });
    const session = await signInAs(await createUserWithRole(busy.id, 'admin'));
    for (let i = 0; i < MAX_LIVE_API_KEYS; i++) await makeKey(session, ['read'], { name: `Key ${i}` });
    asUser(session);
    const out = await callAction(createApiKey, { name: 'One too many', scopes: ['read'] });
    expect((out.state as { code: string }).code).toBe('conflict');
  });
});

describe('calling with a key', () => {
  it('answers /me with the key and its company, and records when and from where it was used', async () => {
    const { token, prefix } = await makeKey(adminSession, ['trade-off'], { name: 'CRM' });
    const res = await me(token, { 'x-forwarded-for': '203.0.113.50' });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { user: unknown; apiKey: { prefix: string; scopes: string[] }; company: { id: number }; permissions: string[] };
    expect(body.user).toBeNull();
    expect(body.apiKey).toMatchObject({ prefix, scopes: ['trade-off'] });
    expect(body.company.id).toBe(company.id);
    expect(body.permissions).toEqual(['tradeoff.api']);
    const row = await models().ApiKey.findOne({ where: { prefix } });
    expect(row!.lastUsedIp).toBe('203.0.113.50');
    expect(Date.now() - row!.lastUsedAt!.getTime()).toBeLessThan(60_000);
  });

  it('refuses a malformed header, an unknown key and a key with one character changed (401)', async () => {
    const { token } = await makeKey(adminSession, ['read']);
    const flipped = token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A');
    for (const header of ['Basic abc', 'Bearer', `Bearer ${flipped}`, `Bearer fl_${'x'.repeat(43)}`, `Bearer ${token} extra`]) {
      asSignedOut();
      const res = await meRoute(apiRequest('/api/v1/me', { headers: { authorization: header } }), noParams);
      expect(res.status, header).toBe(401);
    }
  });

  it('never falls back to a cookie: a bad key with a valid session is still 401, a good key answers for its own company', async () => {
    const otherCompany = await createCompany({ planCode: 'fleet' });
    asUser(await signInAs(await createUserWithRole(otherCompany.id, 'admin')));
    const bad = await meRoute(apiRequest('/api/v1/me', { headers: { authorization: 'Bearer nope' } }), noParams);
    expect(bad.status).toBe(401);
    const { token } = await makeKey(adminSession, ['studies']);
    asUser(await signInAs(await createUserWithRole(otherCompany.id, 'installer')));
    const res = await meRoute(apiRequest('/api/v1/me', { headers: { authorization: `Bearer ${token}` } }), noParams);
    expect(((await res.json()) as { company: { id: number } }).company.id).toBe(company.id);
    asSignedOut();
  });

  it('takes a write with a key from a foreign Origin (no cookie to ride on), while a session write from it is 403', async () => {
    const { token } = await makeKey(adminSession, ['trade-off']);
    const scenario = { site: { latDeg: 47.1, lonDeg: 2.6 }, satellite: { longitudeDeg: -19.5 }, downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 }, receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 }, dishes: [{ diameterM: 0.9, efficiency: 0.65 }] };
    asSignedOut();
    const withKey = await tradeoffRoute(keyRequest(token, '/api/v1/tradeoff', { method: 'POST', json: scenario, headers: { origin: 'https://elsewhere.example' } }), noParams);
    expect(withKey.status).toBe(200);
    asUser(await signInAs(await createUserWithRole(company.id, 'installer')));
    const withSession = await tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: scenario, headers: { origin: 'https://elsewhere.example' } }), noParams);
    expect(withSession.status).toBe(403);
    asSignedOut();
  });
});

describe('revoking', () => {
  it('answers 404 for another company’s key and leaves it working', async () => {
    const other = await createCompany({ planCode: 'fleet' });
    const otherKey = await makeKey(await signInAs(await createUserWithRole(other.id, 'admin')), ['read']);
    const row = await models().ApiKey.findOne({ where: { prefix: otherKey.prefix } });
    asUser(adminSession);
    const out = await callAction(revokeApiKey, { id: String(row!.id) });
    expect((out.state as { code: string }).code).toBe('not_found');
    expect((await me(otherKey.token)).status).toBe(200);
  });
});

describe('the per-minute limit', () => {
  it('lets exactly N of 20 parallel requests through; the rest get 429 with Retry-After', async () => {
    // Keep the burst inside one minute window.
    const intoMinute = Date.now() % 60_000;
    if (intoMinute > 50_000) await new Promise((r) => setTimeout(r, 60_500 - intoMinute));
    const { token, prefix } = await makeKey(adminSession, ['studies'], { rateLimitPerMinute: 7 });
    asSignedOut();
    const answers = await Promise.all(Array.from({ length: 20 }, () => studiesRoute(keyRequest(token, '/api/v1/studies?pageSize=1'), noParams)));
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(7);
    expect(statuses.filter((s) => s === 429)).toHaveLength(13);
    const limited = answers.find((r) => r.status === 429)!;
    const retryAfter = Number(limited.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(60);
    expect(((await limited.json()) as { error: { code: string } }).error.code).toBe('rate_limited');
    const [window] = await models().sequelize.query<{ n: number }>(
      'SELECT w.request_count AS n FROM api_key_rate_windows w JOIN api_keys k ON k.id = w.api_key_id WHERE k.prefix = :prefix',
      { replacements: { prefix }, type: QueryTypes.SELECT },
    );
    expect(Number(window.n)).toBe(20);
  }, 90_000);

  it('counts each key on its own', async () => {
    const a = await makeKey(adminSession, ['studies'], { rateLimitPerMinute: 1 });
    const b = await makeKey(adminSession, ['studies'], { rateLimitPerMinute: 1 });
    asSignedOut();
    expect((await studiesRoute(keyRequest(a.token, '/api/v1/studies'), noParams)).status).toBe(200);
    expect((await studiesRoute(keyRequest(b.token, '/api/v1/studies'), noParams)).status).toBe(200);
    expect((await studiesRoute(keyRequest(a.token, '/api/v1/studies'), noParams)).status).toBe(429);
  });
});

const API_PREFIX_VISIBLE = 11;
