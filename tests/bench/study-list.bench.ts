/**
 * Study list and study page benchmark (`npm run bench:studies`, script to be added by the lead:
 * "tsx tests/bench/study-list.bench.ts"). Seeds 10 000 studies for a bench company of its own
 * (once; later runs reuse them), then measures on loopback against a RUNNING app:
 *   - GET /api/v1/studies (newest page, deep pages, a search), and
 *   - GET /studies/<id> (the server-rendered study page),
 * and prints p50/p95/max in ms. Aim: p95 under 300 ms.
 *
 * Env: the database of the app under test (defaults to .local/test.env, i.e. `npm test`'s),
 * BENCH_URL (default APP_URL), BENCH_REQUESTS per measurement (default 200).
 * Every figure is wall time of one request on loopback, so it is server time plus a
 * loopback round trip (well under a millisecond). Scenario data are invented.
 */
import { randomBytes, createHash } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { loadTestEnv } from '../support/test-env';

loadTestEnv();

const STUDIES = 10_000;
const COMPANY_NAME = 'Benchmark Relay Works (bench data)';
const BATCH = 250;

async function seed(): Promise<{ token: string; studyIds: number[] }> {
  const { models } = await import('../../db/models');
  const { serviceProfileSchema } = await import('../../server/validation/service-profile');
  const { computeStudyFromRows } = await import('../../server/studies/snapshot-of');
  const m = models();
  const plan = await m.Plan.findOne({ where: { code: 'fleet' }, rejectOnEmpty: true });
  let company = await m.Company.findOne({ where: { name: COMPANY_NAME } });
  if (!company) company = await m.Company.create({ name: COMPANY_NAME, planId: plan.id, trialEndsAt: null });
  const email = 'bench-installer@bench.example';
  let user = await m.User.findOne({ where: { email } });
  if (!user) {
    user = await m.User.create({ id: 'usr_' + randomBytes(12).toString('base64url'), email, name: 'Bench Installer', passwordHash: 'not-a-login-account' });
    await m.Membership.create({ companyId: company.id, userId: user.id, role: 'installer' });
  }
  const have = await m.Study.count({ where: { companyId: company.id } });
  if (have < STUDIES) {
    const t0 = performance.now();
    const customer = await m.Customer.create({ companyId: company.id, name: 'Bench customer', email: null, phone: null, notes: null });
    const site = await m.Site.create({ companyId: company.id, customerId: customer.id, name: 'Bench site', address: null, latDeg: '49.500000', lonDeg: '1.250000', altitudeM: '60.0', notes: null });
    const s = serviceProfileSchema.parse({ name: 'Bench service', satelliteName: 'Benchbird-1', satelliteLongitudeDeg: '7 W', downlinkFrequencyGHz: '11.7', polarization: 'linear-vertical', eirpDbw: '50', symbolRateMsps: '27.5', modcod: '8PSK 3/4', implementationMarginDb: '1', lnbNoiseTempK: '60', antennaNoiseTempK: '40' });
    const service = await m.ServiceProfile.create({
      companyId: company.id, name: s.name, satelliteName: s.satelliteName, satelliteLongitudeDeg: s.satelliteLongitudeDeg.toFixed(2), downlinkFrequencyGhz: s.downlinkFrequencyGHz.toFixed(4),
      polarization: s.polarization, polarizationTiltDeg: '0.00', eirpDbw: s.eirpDbw.toFixed(2), symbolRateMsps: s.symbolRateMsps.toFixed(4), modcod: s.modcod, requiredEsN0Db: s.requiredEsN0Db.toFixed(2),
      implementationMarginDb: s.implementationMarginDb.toFixed(2), otherLossesDb: '0.30', lnbNoiseTempK: '60.0', antennaNoiseTempK: '40.0', uplink: null, acmModcods: null, notes: null,
    });
    const climate = await m.ClimateProfile.create({ companyId: company.id, name: 'Bench climate', kind: 'known-r001', data: { r001MmH: 33 }, zeroIsothermKm: '2.800', sourceNote: 'invented for the benchmark', uploadId: null });
    const dishes = [];
    for (const [i, d] of [0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8, 2.4].entries()) {
      dishes.push(await m.Dish.create({ companyId: company.id, name: `Bench ${d * 100} cm`, diameterM: d.toFixed(3), efficiency: '0.650', hardwarePrice: (80 + i * 90).toFixed(2), labourPrice: '120.00', mountNotes: null, active: true }));
    }
    // One real engine result (8 dishes), stored as every study's snapshot: the list and the page read it exactly as they read any study.
    const { inputs, result } = computeStudyFromRows({ site, customerName: customer.name, service, climate, dishes, targetAvailabilityPercent: 99.9 });
    const i = result.tradeoff.recommendation.smallestMeetingTargetIndex;
    const start = Date.now() - STUDIES * 60_000;
    for (let n = have; n < STUDIES; n += BATCH) {
      const rows = [];
      for (let k = n; k < Math.min(STUDIES, n + BATCH); k++) {
        const at = new Date(start + k * 60_000);
        rows.push({
          companyId: company.id, customerId: customer.id, siteId: site.id, serviceProfileId: service.id, climateProfileId: climate.id, revisionOfStudyId: null, revision: 1,
          title: `Bench study ${String(k).padStart(5, '0')} ${k % 97 === 0 ? 'gatehouse' : 'roof'}`, customerName: customer.name, siteName: site.name, serviceName: service.name,
          recommendedDiameterM: i === null ? null : result.tradeoff.options[i].diameterM.toFixed(3), dishCount: inputs.dishes.length, targetAvailabilityPercent: '99.9000',
          inputs, result, engineVersion: result.engineVersion, createdByUserId: user.id, createdAt: at, updatedAt: at,
        });
      }
      await m.Study.bulkCreate(rows);
    }
    console.log(`seeded ${STUDIES - have} studies in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  } else console.log(`reusing ${have} bench studies`);
  const token = randomBytes(32).toString('base64url');
  await m.Session.create({ id: createHash('sha256').update(token).digest('hex'), userId: user.id, activeCompanyId: company.id, expiresAt: new Date(Date.now() + 3600_000), ip: '127.0.0.1', userAgent: 'bench' } as never);
  const ids = (await m.Study.findAll({ where: { companyId: company.id }, attributes: ['id'], order: [['id', 'ASC']] })).map((r) => r.id);
  await m.sequelize.close();
  return { token, studyIds: ids };
}

function pct(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function measure(label: string, urls: () => string, token: string, n: number): Promise<{ label: string; p50: number; p95: number; max: number }> {
  const times: number[] = [];
  for (let i = 0; i < n + 10; i++) {
    const url = urls();
    const t0 = performance.now();
    const res = await fetch(url, { headers: { cookie: `fl_session=${token}`, accept: label.startsWith('GET /studies') ? 'text/html' : 'application/json' }, redirect: 'manual' });
    const body = await res.text();
    const ms = performance.now() - t0;
    if (res.status !== 200) throw new Error(`${url} answered ${res.status}: ${body.slice(0, 200)}`);
    if (i >= 10) times.push(ms); // the first ten warm the server up
  }
  times.sort((a, b) => a - b);
  return { label, p50: pct(times, 50), p95: pct(times, 95), max: times[times.length - 1] };
}

async function main(): Promise<void> {
  const base = (process.env.BENCH_URL ?? process.env.APP_URL ?? 'http://localhost:3100').replace(/\/$/, '');
  const n = Number(process.env.BENCH_REQUESTS ?? 200);
  const { token, studyIds } = await seed();
  const pages = Math.ceil(studyIds.length / 25);
  const pick = <T,>(a: T[]) => a[Math.floor(Math.random() * a.length)];
  const results = [
    await measure('GET /api/v1/studies (first page)', () => `${base}/api/v1/studies?page=1&pageSize=25`, token, n),
    await measure('GET /api/v1/studies (random page of 400)', () => `${base}/api/v1/studies?page=${1 + Math.floor(Math.random() * pages)}&pageSize=25`, token, n),
    await measure('GET /api/v1/studies?q=gatehouse', () => `${base}/api/v1/studies?q=gatehouse&page=1&pageSize=25`, token, n),
    await measure('GET /studies/<id> (study page, SSR)', () => `${base}/studies/${pick(studyIds)}`, token, n),
  ];
  console.log(`\n${studyIds.length} studies in the bench company; ${n} requests each on ${base}`);
  for (const r of results) console.log(`${r.label.padEnd(42)} p50 ${r.p50.toFixed(1).padStart(7)} ms   p95 ${r.p95.toFixed(1).padStart(7)} ms   max ${r.max.toFixed(1).padStart(7)} ms`);
  const worst = Math.max(...results.map((r) => r.p95));
  console.log(`\naim: p95 < 300 ms — ${worst < 300 ? 'met' : 'NOT met'} (worst p95 ${worst.toFixed(1)} ms)`);
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
