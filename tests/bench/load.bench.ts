/**
 * Per-request overhead under load (`npm run bench:load`), against a RUNNING app: autocannon with 8
 * connections on loopback, one after another in the same run,
 *   - GET  /api/health                 (no session, one `SELECT 1`: the floor of a route),
 *   - GET  /api/v1/me                  with a session cookie, and with an API key,
 *   - POST /api/v1/tradeoff (8 dishes) with a session cookie, and with an API key,
 * and prints p50 / p99 latency (ms) and requests per second of each. Aim: the trade-off's p50 at
 * most 1.5× health's. Then, one request at a time, the SQL statements each kind of request costs
 * (MariaDB's global Questions / Com_* counters around 20 sequential requests, minus the reading
 * itself): a figure that does not depend on how busy the machine is.
 *
 * Seeds (once, reused) a bench company on the Fleet plan (API access) with an admin, then opens a
 * fresh session and a fresh key (rate limit high enough not to answer 429 during the run) each run.
 * Env: the database of the app under test (defaults to .local/test.env), BENCH_URL (default
 * APP_URL), BENCH_SECONDS per measurement (default 8). Scenario data are invented.
 */
import { randomBytes, createHash } from 'node:crypto';
import autocannon from 'autocannon';
import { loadTestEnv } from '../support/test-env';

loadTestEnv();

const COMPANY_NAME = 'Benchmark Load Works (bench data)';
const CONNECTIONS = 8;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);

/** Eight dishes, coordinates only (the maps fill in climate and atmosphere): the integrators' usual call. */
const SCENARIO = {
  site: { latDeg: 47.1, lonDeg: 2.6 },
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  dishes: [0.45, 0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8].map((diameterM) => ({ diameterM, efficiency: 0.65 })),
  targetAvailabilityPercent: 99.7,
};

async function seed(): Promise<{ cookie: string; key: string }> {
  const { models } = await import('../../db/models');
  const m = models();
  const plan = await m.Plan.findOne({ where: { code: 'fleet' }, rejectOnEmpty: true });
  let company = await m.Company.findOne({ where: { name: COMPANY_NAME } });
  if (!company) company = await m.Company.create({ name: COMPANY_NAME, planId: plan.id, trialEndsAt: null });
  const email = 'bench-load-admin@bench.example';
  let user = await m.User.findOne({ where: { email } });
  if (!user) {
    user = await m.User.create({ id: 'usr_' + randomBytes(12).toString('base64url'), email, name: 'Bench Load Admin', passwordHash: 'not-a-login-account' });
    await m.Membership.create({ companyId: company.id, userId: user.id, role: 'admin' });
  }
  // Sessions are keyed by the sha256 of the cookie token (server/auth/sequelize-adapter.ts).
  const token = randomBytes(32).toString('base64url');
  await m.Session.create({ id: createHash('sha256').update(token).digest('hex'), userId: user.id, activeCompanyId: company.id, expiresAt: new Date(Date.now() + 30 * 86_400_000), ip: '127.0.0.1', userAgent: 'bench' } as never);
  const key = `fl_${randomBytes(32).toString('base64url')}`;
  await m.ApiKey.create({
    companyId: company.id, name: `bench ${new Date().toISOString()}`, prefix: key.slice(0, 11), tokenHash: createHash('sha256').update(key).digest('hex'),
    scopes: 'read,trade-off', rateLimitPerMinute: 1_000_000, createdByUserId: user.id,
  } as never);
  return { cookie: `fl_session=${token}`, key };
}

type Measure = { name: string; method: 'GET' | 'POST'; path: string; headers?: Record<string, string>; body?: string };

async function run(base: string, m: Measure): Promise<{ p50: number; p99: number; rps: number; non2xx: number; errors: number }> {
  const result = await autocannon({
    url: base + m.path,
    method: m.method,
    headers: m.headers,
    body: m.body,
    connections: CONNECTIONS,
    duration: SECONDS,
  });
  return { p50: result.latency.p50, p99: result.latency.p99, rps: result.requests.average, non2xx: result.non2xx, errors: result.errors };
}

type Counters = { all: number; writes: number };

/** Statements the server has run so far: every statement, and the writing ones (these counters are server-wide). */
async function counters(): Promise<Counters> {
  const { models } = await import('../../db/models');
  const rows = await models().sequelize.query<{ Variable_name: string; Value: string }>(
    "SHOW GLOBAL STATUS WHERE Variable_name IN ('Questions','Com_insert','Com_update','Com_delete','Com_insert_select','Com_replace')",
    { type: 'SELECT' as never },
  );
  const v = (n: string) => Number(rows.find((r) => r.Variable_name === n)?.Value ?? 0);
  return { all: v('Questions'), writes: v('Com_insert') + v('Com_update') + v('Com_delete') + v('Com_insert_select') + v('Com_replace') };
}

async function statementsPerRequest(base: string, m: Measure, n = 20): Promise<Counters> {
  const idle0 = await counters();
  const idle1 = await counters();
  const reading = idle1.all - idle0.all; // what one counters() call itself adds
  const before = await counters();
  for (let i = 0; i < n; i++) {
    const res = await fetch(base + m.path, { method: m.method, headers: m.headers, body: m.body });
    await res.arrayBuffer();
  }
  const after = await counters();
  return { all: (after.all - before.all - reading) / n, writes: (after.writes - before.writes) / n };
}

async function main(): Promise<void> {
  const base = (process.env.BENCH_URL ?? process.env.APP_URL ?? 'http://localhost:3100').replace(/\/$/, '');
  const health = await fetch(base + '/api/health').catch(() => null);
  if (!health?.ok) throw new Error(`No app answering at ${base}/api/health: start it first (see DEVELOPERS.md, "one browser spec").`);
  const { cookie, key } = await seed();
  const json = { 'content-type': 'application/json' };
  const bearer = { authorization: `Bearer ${key}` };
  const body = JSON.stringify(SCENARIO);
  const probe = await fetch(base + '/api/v1/tradeoff', { method: 'POST', headers: { ...json, ...bearer }, body });
  if (!probe.ok) throw new Error(`The trade-off refused the bench scenario: ${probe.status} ${await probe.text()}`);

  const measures: Measure[] = [
    { name: 'GET  /api/health', method: 'GET', path: '/api/health' },
    { name: 'GET  /api/v1/me (session)', method: 'GET', path: '/api/v1/me', headers: { cookie } },
    { name: 'GET  /api/v1/me (API key)', method: 'GET', path: '/api/v1/me', headers: bearer },
    { name: 'POST /api/v1/tradeoff 8 dishes (session)', method: 'POST', path: '/api/v1/tradeoff', headers: { ...json, cookie }, body },
    { name: 'POST /api/v1/tradeoff 8 dishes (API key)', method: 'POST', path: '/api/v1/tradeoff', headers: { ...json, ...bearer }, body },
  ];
  console.log(`${CONNECTIONS} connections, ${SECONDS} s each, ${base}`);
  console.log('what'.padEnd(44) + 'p50 ms'.padStart(8) + 'p99 ms'.padStart(8) + 'req/s'.padStart(9) + '  non-2xx');
  const figures: Record<string, number> = {};
  for (const m of measures) {
    const r = await run(base, m);
    figures[m.name] = r.p50;
    console.log(m.name.padEnd(44) + r.p50.toFixed(1).padStart(8) + r.p99.toFixed(1).padStart(8) + r.rps.toFixed(0).padStart(9) + `  ${r.non2xx + r.errors}`);
  }
  const floor = Math.max(figures['GET  /api/health'], 1);
  for (const name of measures.slice(3).map((m) => m.name)) console.log(`${name}: p50 ${(figures[name] / floor).toFixed(2)}× health (aim ≤ 1.5×)`);

  console.log('\nSQL statements per request (one at a time; server-wide counters, so run it on a quiet database)');
  console.log('what'.padEnd(44) + 'all'.padStart(8) + 'writes'.padStart(8));
  for (const m of measures) {
    const c = await statementsPerRequest(base, m);
    console.log(m.name.padEnd(44) + c.all.toFixed(1).padStart(8) + c.writes.toFixed(1).padStart(8));
  }
  const { models } = await import('../../db/models');
  await models().sequelize.close();
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
