import { apiRequest, asSignedOut, asUser } from './support/next-request';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { GET as meRoute } from '@/app/api/v1/me/route';
import { POST as tradeoffRoute } from '@/app/api/v1/tradeoff/route';
import { LAST_USED_PRECISION_MS } from '@/db/queries/api-keys';
import { createCompany, createUserWithRole, signInAs, type TestUser } from './support/factories';
import { keyRequest, makeKey } from './support/api-keys';

/**
 * Per-request overhead (issue: trade-off p50 4–5× a bare route): who is calling, their role in the
 * company and the company's plan come back in ONE query for a session and in two for an API key
 * (the key with its plan, the rate-window upsert), and an ordinary call writes nothing to the key
 * or session rows. Counted by spying on every statement Sequelize sends.
 */
const noParams = { params: Promise.resolve({}) };
const SCENARIO = {
  site: { latDeg: 47.1, lonDeg: 2.6 },
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  dishes: [0.45, 0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8].map((diameterM) => ({ diameterM, efficiency: 0.65 })),
  targetAvailabilityPercent: 99.7,
  atmosphere: null,
};

let company: { id: number };
let admin: TestUser;
let session: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  admin = await createUserWithRole(company.id, 'admin');
  session = await signInAs(admin);
});
afterEach(() => {
  vi.restoreAllMocks();
  asSignedOut();
});
afterAll(closeSequelize);

/** Runs fn and returns its result with the SQL statements it sent. */
async function counted<T>(fn: () => Promise<T>): Promise<{ value: T; sql: string[] }> {
  const { sequelize } = models();
  const original = sequelize.query.bind(sequelize);
  const sql: string[] = [];
  vi.spyOn(sequelize, 'query').mockImplementation(((q: unknown, ...rest: unknown[]) => {
    sql.push(typeof q === 'string' ? q.trim().split(/\s+/).slice(0, 3).join(' ') : String(q));
    return (original as (...a: unknown[]) => unknown)(q, ...rest);
  }) as never);
  try {
    return { value: await fn(), sql };
  } finally {
    vi.restoreAllMocks();
  }
}

const isWrite = (s: string) => /^(INSERT|UPDATE|DELETE|REPLACE)/i.test(s);

describe('with a session', () => {
  it('the 8-dish trade-off costs one query: session, membership, role and plan together, no lock, no write', async () => {
    asUser(session);
    const { value: res, sql } = await counted(() => tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: SCENARIO }), noParams));
    expect(res.status, await res.clone().text()).toBe(200);
    expect(sql).toHaveLength(1);
    expect(sql.some(isWrite)).toBe(false);
  });

  it('/me costs two (the caller, then the list of their companies)', async () => {
    asUser(session);
    const { value: res, sql } = await counted(() => meRoute(apiRequest('/api/v1/me'), noParams));
    expect(res.status).toBe(200);
    expect(((await res.json()) as { role: string }).role).toBe('admin');
    expect(sql).toHaveLength(2);
    expect(sql.some(isWrite)).toBe(false);
  });

  it('still sees a plan change at once (read with the session, not kept in the process)', async () => {
    const other = await createCompany({ planCode: 'fleet' });
    const installer = await createUserWithRole(other.id, 'installer');
    asUser(await signInAs(installer));
    expect((await tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: SCENARIO }), noParams)).status).toBe(200);
    const crew = await models().Plan.findOne({ where: { code: 'crew' }, rejectOnEmpty: true });
    await models().Company.update({ planId: crew.id }, { where: { id: other.id } });
    const refused = await tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: SCENARIO }), noParams);
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { error: { code: string } }).error.code).toBe('plan_limit');
  });
});

describe('with an API key', () => {
  it('an ordinary call costs two statements and writes only the rate window; last use is rewritten once it is stale', async () => {
    const { token } = await makeKey(session, ['trade-off', 'read']);
    const call = () => tradeoffRoute(keyRequest(token, '/api/v1/tradeoff', { method: 'POST', json: SCENARIO }), noParams);
    expect((await call()).status).toBe(200);
    const lastUsed = async () =>
      (await models().sequelize.query<{ last_used_at: Date }>('SELECT last_used_at FROM api_keys WHERE prefix = :p', { replacements: { p: token.slice(0, 11) }, type: QueryTypes.SELECT }))[0].last_used_at;
    const first = await lastUsed();
    expect(first).not.toBeNull();

    const { value: res, sql } = await counted(call);
    expect(res.status).toBe(200);
    expect(sql).toHaveLength(2);
    expect(sql.filter(isWrite)).toEqual([expect.stringMatching(/^INSERT INTO api_key_rate_windows/)]);
    expect((await lastUsed()).getTime()).toBe(new Date(first).getTime());

    // Older than the precision: the next call records the use again.
    await models().sequelize.query('UPDATE api_keys SET last_used_at = :at WHERE prefix = :p', {
      replacements: { at: new Date(Date.now() - LAST_USED_PRECISION_MS - 5_000), p: token.slice(0, 11) }, type: QueryTypes.UPDATE,
    });
    expect((await call()).status).toBe(200);
    expect(Date.now() - new Date(await lastUsed()).getTime()).toBeLessThan(10_000);
  });

  it('counts every request of the window exactly, in one statement each', async () => {
    const { token } = await makeKey(session, ['read'], { rateLimitPerMinute: 12 });
    const answers = await Promise.all(Array.from({ length: 20 }, () => meRoute(keyRequest(token, '/api/v1/me'), noParams)));
    const codes = answers.map((r) => r.status).sort();
    expect(codes.filter((c) => c === 200)).toHaveLength(12);
    expect(codes.filter((c) => c === 429)).toHaveLength(8);
  });
});
