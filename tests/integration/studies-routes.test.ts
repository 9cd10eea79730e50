import { apiRequest, asSignedOut, asUser } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { GET as listStudiesRoute } from '@/app/api/v1/studies/route';
import { GET as getStudyRoute } from '@/app/api/v1/studies/[id]/route';
import { GET as listSitesRoute } from '@/app/api/v1/sites/route';
import { GET as listCustomersRoute } from '@/app/api/v1/customers/route';
import { GET as dashboardRoute } from '@/app/api/v1/dashboard/route';
import { POST as tradeoffRoute } from '@/app/api/v1/tradeoff/route';
import { createStudy } from '@/server/studies/create-study';
import { dishTradeoff } from '@/server/engine';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { createStudyWorld, type StudyWorld } from './studies-fixtures';

/** The JSON routes of studies: roles, company scoping (404 across companies), search and paging, the unsaved trade-off. */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let world: StudyWorld;
const tok: Record<string, string> = {};
const studyIds: number[] = [];
let otherStudyId: number;

const noParams = { params: Promise.resolve({}) };

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(home.id);
  const otherWorld = await createStudyWorld(other.id);
  for (const role of ['admin', 'installer', 'sales'] as const) {
    const u = await createUserWithRole(home.id, role);
    tok[role] = await signInAs(u);
    if (role === 'installer') tok.installerId = u.id;
  }
  const outsider = await createUserWithRole(other.id, 'admin');
  tok.outsider = await signInAs(outsider);
  for (let i = 0; i < 7; i++) {
    const { id } = await createStudy(
      { companyId: home.id, userId: tok.installerId },
      { title: i === 3 ? 'Upgrade for the heron_pond gatehouse' : i === 5 ? 'Fen pond relay' : `Routine study ${i}`, customer: { id: world.customerId }, site: { id: world.siteId }, serviceProfileId: world.serviceId, climateProfileId: world.climateId, dishIds: world.dishIds, targetAvailabilityPercent: 99.9 },
    );
    studyIds.push(id);
  }
  otherStudyId = (await createStudy({ companyId: other.id, userId: outsider.id }, { title: 'Theirs', customer: { id: otherWorld.customerId }, site: { id: otherWorld.siteId }, serviceProfileId: otherWorld.serviceId, climateProfileId: otherWorld.climateId, dishIds: otherWorld.dishIds, targetAvailabilityPercent: 99.9 })).id;
});

async function json(res: Response) {
  return { status: res.status, body: await res.json() };
}

describe('GET /api/v1/studies', () => {
  it('lists this company’s studies newest first, paged, for every company role', async () => {
    for (const role of ['admin', 'installer', 'sales']) {
      asUser(tok[role]);
      const { status, body } = await json(await listStudiesRoute(apiRequest('/api/v1/studies?page=1&pageSize=5'), noParams));
      expect(status).toBe(200);
      expect(body).toMatchObject({ page: 1, pageSize: 5, total: 7, pageCount: 2 });
      expect(body.items.map((s: { id: number }) => s.id)).toEqual([...studyIds].reverse().slice(0, 5));
      expect(body.items[0]).not.toHaveProperty('inputs');
      expect(body.items[0]).toMatchObject({ dishCount: 3, recommendedDiameterM: expect.any(Number), engineVersion: expect.any(String) });
    }
    const page2 = await json(await listStudiesRoute(apiRequest('/api/v1/studies?page=2&pageSize=5'), noParams));
    expect(page2.body.items.map((s: { id: number }) => s.id)).toEqual([studyIds[1], studyIds[0]]);
  });

  it('searches title, customer, site and service; % and _ are literal', async () => {
    asUser(tok.sales);
    const hit = await json(await listStudiesRoute(apiRequest('/api/v1/studies?q=heron_pond'), noParams));
    expect(hit.body.items.map((s: { id: number }) => s.id)).toEqual([studyIds[3]]);
    // 'Fen pond relay' would match n_p if _ were a wildcard.
    const underscoreOnly = await json(await listStudiesRoute(apiRequest('/api/v1/studies?q=n_p'), noParams));
    expect(underscoreOnly.body.total).toBe(1);
    const percent = await json(await listStudiesRoute(apiRequest('/api/v1/studies?q=%25'), noParams));
    expect(percent.body.total).toBe(0);
  });

  it('never shows another company’s studies and refuses bad paging with 422', async () => {
    asUser(tok.outsider);
    const theirs = await json(await listStudiesRoute(apiRequest('/api/v1/studies'), noParams));
    expect(theirs.body.items.map((s: { id: number }) => s.id)).toEqual([otherStudyId]);
    const bad = await json(await listStudiesRoute(apiRequest('/api/v1/studies?pageSize=1000'), noParams));
    expect(bad.status).toBe(422);
    expect(bad.body.error.fieldErrors).toHaveProperty('pageSize');
  });

  it('is 401 signed out', async () => {
    asSignedOut();
    expect((await listStudiesRoute(apiRequest('/api/v1/studies'), noParams)).status).toBe(401);
  });
});

describe('GET /api/v1/studies/:id', () => {
  it('returns the snapshots to the company, 404 to anyone else and for junk ids', async () => {
    asUser(tok.sales);
    const mine = await json(await getStudyRoute(apiRequest(`/api/v1/studies/${studyIds[0]}`), { params: Promise.resolve({ id: String(studyIds[0]) }) }));
    expect(mine.status).toBe(200);
    expect(mine.body.inputs.dishes).toHaveLength(3);
    expect(mine.body.result.tradeoff.options).toHaveLength(3);
    asUser(tok.outsider);
    const theirs = await json(await getStudyRoute(apiRequest(`/api/v1/studies/${studyIds[0]}`), { params: Promise.resolve({ id: String(studyIds[0]) }) }));
    expect(theirs).toEqual({ status: 404, body: { error: { code: 'not_found', message: 'That study was not found.' } } });
    for (const junk of ['abc', '1e3', '-1', '99999999999999']) {
      expect((await getStudyRoute(apiRequest(`/api/v1/studies/${junk}`), { params: Promise.resolve({ id: junk }) })).status).toBe(404);
    }
  });
});

describe('GET /api/v1/sites and /api/v1/customers', () => {
  it('are company-scoped, searchable and readable by sales', async () => {
    asUser(tok.sales);
    const sites = await json(await listSitesRoute(apiRequest('/api/v1/sites?q=barn'), noParams));
    expect(sites.status).toBe(200);
    expect(sites.body.items).toEqual([expect.objectContaining({ id: world.siteId, latDeg: 47.123456, lonDeg: 2.654321, altitudeM: 140, studyCount: 7 })]);
    const customers = await json(await listCustomersRoute(apiRequest('/api/v1/customers?q=Fenwold'), noParams));
    expect(customers.body.items).toEqual([expect.objectContaining({ id: world.customerId, siteCount: 1 })]);
    asUser(tok.outsider);
    const foreign = await json(await listSitesRoute(apiRequest('/api/v1/sites?q=barn'), noParams));
    expect(foreign.body.items.map((s: { id: number }) => s.id)).not.toContain(world.siteId);
    const foreignCustomer = await json(await listSitesRoute(apiRequest(`/api/v1/sites?customerId=${world.customerId}`), noParams));
    expect(foreignCustomer.body.total).toBe(0);
  });
});

describe('GET /api/v1/dashboard', () => {
  it('counts this company’s rows', async () => {
    asUser(tok.sales);
    const { body } = await json(await dashboardRoute(apiRequest('/api/v1/dashboard'), noParams));
    expect(body.counts).toMatchObject({ studies: 7, studiesThisMonth: 7, customers: 1, sites: 1, dishes: 3 });
    expect(body.recent[0].id).toBe(studyIds[6]);
  });
});

describe('POST /api/v1/tradeoff', () => {
  // Invented scenario (demo figures) in the engine's own shape.
  const scenario = {
    site: { latDeg: 47.1, lonDeg: 2.6, altitudeKm: 0.14 },
    satellite: { longitudeDeg: -19.5 },
    downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
    receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
    rain: { r001MmH: 32, zeroIsothermHeightKm: 2.9 },
    dishes: [{ diameterM: 0.6, efficiency: 0.65, priceUsd: '89.00' }, { diameterM: 0.9, efficiency: 0.65, priceUsd: '189.00' }],
    targetAvailabilityPercent: 99.9,
  };
  const post = (body: unknown) => tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: body }), noParams);

  it('returns exactly the engine’s result and saves nothing (atmosphere: null, rain only; the maps are tested in tradeoff-api.test.ts)', async () => {
    asUser(tok.installer);
    const { status, body } = await json(await post({ ...scenario, atmosphere: null }));
    expect(status).toBe(200);
    expect(body).toEqual({ ...JSON.parse(JSON.stringify(dishTradeoff(scenario))), mapInputs: { filled: [], mapVersions: [] } });
  });

  it('is for installers and admins only', async () => {
    asUser(tok.admin);
    expect((await post(scenario)).status).toBe(200);
    asUser(tok.sales);
    expect((await post(scenario)).status).toBe(403);
    asSignedOut();
    expect((await post(scenario)).status).toBe(401);
  });

  it('is refused with plan_limit on a plan without API access (crew: api_access false in the plan catalogue migration)', async () => {
    const crew = await createCompany({ planCode: 'crew' });
    asUser(await signInAs(await createUserWithRole(crew.id, 'installer')));
    const res = await json(await post(scenario));
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('plan_limit');
  });

  it('422 with the field named for a bad shape or a value the engine refuses', async () => {
    asUser(tok.installer);
    const shape = await json(await post({ ...scenario, dishes: [{ diameterM: 'big', efficiency: 0.6 }] }));
    expect(shape.status).toBe(422);
    expect(Object.keys(shape.body.error.fieldErrors)).toEqual(['dishes.0.diameterM']);
    const range = await json(await post({ ...scenario, dishes: [{ diameterM: -1, efficiency: 0.6 }] }));
    expect(range.status).toBe(422);
    expect(Object.keys(range.body.error.fieldErrors)).toEqual(['dishes.0.diameterM']);
    // A measured curve that stops at 0.1 % cannot give R0.01: only the engine can say so.
    const engine = await json(await post({ ...scenario, rain: { measuredCurve: [{ pPercent: 1, rainRateMmH: 2 }, { pPercent: 0.1, rainRateMmH: 9 }] } }));
    expect(engine.status).toBe(422);
    expect(Object.keys(engine.body.error.fieldErrors)).toEqual(['rain.measuredCurve']);
    const horizon = await json(await post({ ...scenario, satellite: { longitudeDeg: 150 } }));
    expect(horizon.body.error.message).toMatch(/below the horizon/);
    const foreignOrigin = await tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: scenario, headers: { origin: 'https://elsewhere.example' } }), noParams);
    expect(foreignOrigin.status).toBe(403);
  });
});
