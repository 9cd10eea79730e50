import { asSignedOut, asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import * as customerActions from '@/server/actions/customers';
import * as siteActions from '@/server/actions/sites';
import * as serviceActions from '@/server/actions/services';
import * as catalogueActions from '@/server/actions/catalogue';
import * as climateActions from '@/server/actions/climate';
import * as studyActions from '@/server/actions/studies';
import * as uploadActions from '@/server/actions/uploads';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { countRows, createStudyWorld, TEST_SERVICE_FORM, type StudyWorld } from './studies-fixtures';

/**
 * Every part-A server action × every company role: allowed or denied as the permission map says
 * (server/auth/permissions.ts), and a member of another company reaching our rows by id gets
 * "not found", never the row.
 */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let world: StudyWorld;
let otherWorld: StudyWorld;
const tokens: Record<'admin' | 'installer' | 'sales' | 'outsider', string> = { admin: '', installer: '', sales: '', outsider: '' };

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(home.id);
  otherWorld = await createStudyWorld(other.id);
  for (const role of ['admin', 'installer', 'sales'] as const) tokens[role] = await signInAs(await createUserWithRole(home.id, role));
  tokens.outsider = await signInAs(await createUserWithRole(other.id, 'admin'));
});

const csvFile = (text: string, name = 'file.csv') => new File([text], name, { type: 'text/csv' });
const DISH_CSV = 'name,diameter_m,efficiency,hardware_price,labour_price\nMatrix 80,0.8,0.66,150,90\n';

type Case = { name: string; allowed: readonly ('admin' | 'installer' | 'sales')[]; run: () => Promise<{ state?: { ok: boolean; code?: string } }> };

const newStudy = () => ({
  customerId: String(world.customerId),
  siteId: String(world.siteId),
  serviceProfileId: String(world.serviceId),
  climateProfileId: String(world.climateId),
  dishIds: world.dishIds.join(','),
  targetAvailabilityPercent: '99.9',
});

const CASES: Case[] = [
  { name: 'createCustomer', allowed: ['admin', 'installer'], run: () => callAction(customerActions.createCustomer, { name: `Ashgrove Cottage ${Math.random()}` }) },
  { name: 'updateCustomer', allowed: ['admin', 'installer'], run: () => callAction(customerActions.updateCustomer, { id: String(world.customerId), name: 'Renamed customer' }) },
  { name: 'createSite', allowed: ['admin', 'installer'], run: () => callAction(siteActions.createSite, { customerId: String(world.customerId), name: 'Gable end', latDeg: `47°07'24.4"N`, lonDeg: '2 39 15.6 E', altitudeM: '150' }) },
  { name: 'updateSite', allowed: ['admin', 'installer'], run: () => callAction(siteActions.updateSite, { id: String(world.siteId), customerId: String(world.customerId), name: 'Long barn roof', latDeg: '47.123456', lonDeg: '2.654321', altitudeM: '140' }) },
  { name: 'createServiceProfile', allowed: ['admin', 'installer'], run: () => callAction(serviceActions.createServiceProfile, { ...TEST_SERVICE_FORM, name: 'Another bouquet' }) },
  { name: 'updateServiceProfile', allowed: ['admin', 'installer'], run: () => callAction(serviceActions.updateServiceProfile, { ...TEST_SERVICE_FORM, id: String(world.serviceId) }) },
  { name: 'createDish', allowed: ['admin'], run: () => callAction(catalogueActions.createDish, { name: `Extra ${Math.random()}`, diameterM: '1.5', efficiency: '0.68', hardwarePrice: '499', labourPrice: '220', active: 'on' }) },
  { name: 'updateDish', allowed: ['admin'], run: () => callAction(catalogueActions.updateDish, { id: String(world.dishIds[0]), name: `Renamed ${Math.random()}`, diameterM: '0.6', efficiency: '0.65', hardwarePrice: '89', labourPrice: '95', active: 'on' }) },
  { name: 'createClimateProfile', allowed: ['admin'], run: () => callAction(climateActions.createClimateProfile, { name: 'Zone K', kind: 'climate-zone', zone: 'K', sourceNote: 'ITU-R P.837-1 map' }) },
  { name: 'createStudy', allowed: ['admin', 'installer'], run: () => callAction(studyActions.createStudy, newStudy()) },
  { name: 'previewCatalogueUpload', allowed: ['admin'], run: () => callAction(uploadActions.previewCatalogueUpload, { file: csvFile(DISH_CSV) }) },
  { name: 'confirmCatalogueUpload', allowed: ['admin'], run: () => callAction(uploadActions.confirmCatalogueUpload, { file: csvFile(DISH_CSV) }) },
  { name: 'previewClimateUpload', allowed: ['admin'], run: () => callAction(uploadActions.previewClimateUpload, { kind: 'rain-curve', file: csvFile('p_percent,rain_rate_mm_h\n1,2\n0.001,80\n') }) },
];

describe('part-A actions × roles', () => {
  for (const c of CASES) {
    for (const role of ['admin', 'installer', 'sales'] as const) {
      const allowed = c.allowed.includes(role);
      it(`${c.name} as ${role}: ${allowed ? 'allowed' : 'denied'}`, async () => {
        asUser(tokens[role]);
        const out = await c.run();
        if (allowed) expect(out.state).toMatchObject({ ok: true });
        else expect(out.state).toMatchObject({ ok: false, code: 'forbidden' });
      });
    }
    it(`${c.name} signed out: unauthenticated`, async () => {
      asSignedOut();
      expect((await c.run()).state).toMatchObject({ ok: false, code: 'unauthenticated' });
    });
  }
});

describe('another company’s rows by id are "not found"', () => {
  it('update, delete and use in a study all say not found and change nothing', async () => {
    asUser(tokens.outsider);
    const { Customer, Site, Dish, ServiceProfile } = models();
    const before = JSON.stringify(await Promise.all([Customer.findByPk(world.customerId), Site.findByPk(world.siteId), Dish.findByPk(world.dishIds[1]), ServiceProfile.findByPk(world.serviceId)]));
    const attempts = [
      callAction(customerActions.updateCustomer, { id: String(world.customerId), name: 'Taken over' }),
      callAction(customerActions.deleteCustomer, { id: String(world.customerId) }),
      callAction(siteActions.updateSite, { id: String(world.siteId), customerId: String(otherWorld.customerId), name: 'x', latDeg: '1', lonDeg: '1' }),
      callAction(siteActions.createSite, { customerId: String(world.customerId), name: 'x', latDeg: '1', lonDeg: '1' }),
      callAction(serviceActions.updateServiceProfile, { ...TEST_SERVICE_FORM, id: String(world.serviceId) }),
      callAction(serviceActions.deleteServiceProfile, { id: String(world.serviceId) }),
      callAction(catalogueActions.updateDish, { id: String(world.dishIds[1]), name: 'x', diameterM: '1', efficiency: '0.6', hardwarePrice: '1', labourPrice: '1' }),
      callAction(catalogueActions.deleteDish, { id: String(world.dishIds[1]) }),
      callAction(climateActions.deleteClimateProfile, { id: String(world.climateId) }),
      // Their own customer and site, but our service, climate and dishes:
      callAction(studyActions.createStudy, { ...newStudy(), customerId: String(otherWorld.customerId), siteId: String(otherWorld.siteId) }),
      callAction(studyActions.createStudy, { ...newStudy(), serviceProfileId: String(otherWorld.serviceId), climateProfileId: String(otherWorld.climateId), dishIds: otherWorld.dishIds.join(',') }),
      callAction(studyActions.createStudy, { customerId: String(otherWorld.customerId), siteId: String(otherWorld.siteId), serviceProfileId: String(otherWorld.serviceId), climateProfileId: String(otherWorld.climateId), dishIds: [...otherWorld.dishIds, world.dishIds[0]].join(',') }),
    ];
    for (const out of await Promise.all(attempts)) expect(out.state).toMatchObject({ ok: false, code: 'not_found' });
    const after = JSON.stringify(await Promise.all([Customer.findByPk(world.customerId), Site.findByPk(world.siteId), Dish.findByPk(world.dishIds[1]), ServiceProfile.findByPk(world.serviceId)]));
    expect(after).toBe(before);
  });

  it('re-running another company’s study is "not found"', async () => {
    asUser(tokens.installer);
    const made = await callAction(studyActions.createStudy, newStudy());
    const id = (made.state as { data: { id: number } }).data.id;
    asUser(tokens.outsider);
    const studiesBefore = await countRows('studies', other.id);
    expect((await callAction(studyActions.rerunStudy, { id: String(id) })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect(await countRows('studies', other.id)).toBe(studiesBefore);
  });
});

describe('study creation', () => {
  it('a new customer needs a new site: an existing site id is not taken over, and nothing is saved', async () => {
    asUser(tokens.installer);
    const [customers, studies] = [await countRows('customers', home.id), await countRows('studies', home.id)];
    const { customerId: _c, ...rest } = newStudy();
    const out = await callAction(studyActions.createStudy, { ...rest, customerMode: 'new', newCustomerName: 'Larchmere Forge' });
    expect(out.state).toMatchObject({ ok: false });
    expect(out.state).toMatchObject({ code: 'invalid_input', fieldErrors: { siteName: expect.any(Array) } });
    expect([await countRows('customers', home.id), await countRows('studies', home.id)]).toEqual([customers, studies]);
  });

  it('creates a customer and site typed in DMS together with the study, in one go', async () => {
    asUser(tokens.installer);
    const out = await callAction(studyActions.createStudy, {
      customerMode: 'new',
      newCustomerName: 'Brackenridge Kennels',
      siteMode: 'new',
      siteName: 'Kennel block',
      latDeg: `46°30'00"N`,
      lonDeg: `3°15'00"E`,
      altitudeM: '220',
      serviceProfileId: String(world.serviceId),
      climateProfileId: String(world.climateId),
      dishIds: [String(world.dishIds[2]), String(world.dishIds[0])],
      targetAvailabilityPercent: '99.95',
    });
    expect(out.state).toMatchObject({ ok: true });
    const id = (out.state as { data: { id: number } }).data.id;
    const { Study, Site } = models();
    const study = await Study.findByPk(id);
    expect(study?.companyId).toBe(home.id);
    const site = await Site.findByPk(study!.siteId!);
    expect([site?.latDeg, site?.lonDeg, site?.altitudeM]).toEqual(['46.500000', '3.250000', '220.0']);
    expect(study?.dishCount).toBe(2);
  });

  it('a refused study leaves no new customer or site behind', async () => {
    asUser(tokens.installer);
    const customers = await countRows('customers', home.id);
    const sites = await countRows('sites', home.id);
    // An invented satellite at 150° E cannot be seen from 47° N, 2.7° E: the engine refuses.
    const { createServiceProfile } = await import('@/db/queries/service-profiles');
    const { serviceProfileSchema } = await import('@/server/validation/service-profile');
    const far = await createServiceProfile(home.id, serviceProfileSchema.parse({ ...TEST_SERVICE_FORM, name: 'Far side', satelliteLongitudeDeg: '150 E' }));
    const out = await callAction(studyActions.createStudy, {
      customerMode: 'new', newCustomerName: 'Nobody', siteMode: 'new', siteName: 'Nowhere', latDeg: '47', lonDeg: '2.7',
      serviceProfileId: String(far.id), climateProfileId: String(world.climateId), dishIds: String(world.dishIds[0]),
    });
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { serviceProfileId: [expect.stringMatching(/below the horizon/)] } });
    expect(await countRows('customers', home.id)).toBe(customers);
    expect(await countRows('sites', home.id)).toBe(sites);
  });

  it('reports form errors by field', async () => {
    asUser(tokens.installer);
    const out = await callAction(studyActions.createStudy, { customerMode: 'new', siteMode: 'new', latDeg: '95', lonDeg: '12 75 0 E', dishIds: '', targetAvailabilityPercent: '80' });
    expect(out.state?.ok).toBe(false);
    const fe = (out.state as { fieldErrors: Record<string, string[]> }).fieldErrors;
    // Every problem at once, the customer and site ones included. No climate is no problem: the ITU-R maps at the site are the default.
    expect(Object.keys(fe).sort()).toEqual(['dishIds', 'latDeg', 'lonDeg', 'newCustomerName', 'serviceProfileId', 'siteName', 'targetAvailabilityPercent'].sort());
    expect(fe.lonDeg).toEqual(['Minutes must be below 60.']);
    expect(fe.dishIds).toEqual(['Choose at least one dish.']);
  });
});
