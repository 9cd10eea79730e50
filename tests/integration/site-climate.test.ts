import { asUser, callAction, callPage } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { getStudy } from '@/db/queries/studies';
import { createSite } from '@/db/queries/sites';
import { insertStudy } from '@/db/queries/studies';
import * as studyActions from '@/server/actions/studies';
import * as siteActions from '@/server/actions/sites';
import * as climateActions from '@/server/actions/climate';
import { confirmClimateUpload } from '@/server/actions/uploads';
import { MAP_DATA_VERSION, siteClimate } from '@/server/climate-maps';
import { dishTradeoff } from '@/server/engine';
import { buildScenario } from '@/server/studies/build-scenario';
import { exceedanceCurve } from '@/server/studies/compute-study';
import { climatePlaceOf, greatCircleKm } from '@/server/studies/climate-location';
import { mapsAltitudeM } from '@/server/studies/maps-climate';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf, siteSnapshotOf } from '@/server/studies/snapshot-of';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import StudyPage from '@/app/(app)/studies/[id]/page';
import { createCompany, createUserWithRole, signInAs, suffix, type TestCompany } from './support/factories';
import { countRows, createStudyWorld, type StudyWorld } from './studies-fixtures';

/**
 * Issue 9, "every figure from the site's own climate", through the real actions and MariaDB: a
 * study made from coordinates alone reads the ITU-R maps (rain climate, P.1511-1 altitude with its
 * source, gases, clouds, scintillation); a company profile overrides the rain climate only and
 * warns when made far away or for an unknown place; a site without map data is a 422 on the
 * latitude; re-runs keep working, old studies too; the study page says where each figure came from.
 */
afterAll(closeSequelize);

// The page's buttons use the app router, which is not mounted outside Next.
vi.mock('next/navigation', async (importOriginal) => ({ ...(await importOriginal<typeof import('next/navigation')>()), useRouter: () => ({ refresh() {}, push() {}, replace() {}, back() {}, forward() {}, prefetch() {} }) }));

let company: TestCompany;
let world: StudyWorld;
let installer: string;
let admin: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(company.id);
  installer = await signInAs(await createUserWithRole(company.id, 'installer'));
  admin = await signInAs(await createUserWithRole(company.id, 'admin'));
});

// An invented farm at a point of open country (decimal and DMS forms of 46.5° N, 3.25° E).
const SITE = { latDeg: 46.5, lonDeg: 3.25 };
const newSiteStudy = (over: Record<string, unknown> = {}) => ({
  customerMode: 'new',
  newCustomerName: `Harrowgate Dairy ${suffix()}`,
  siteMode: 'new',
  siteName: 'Milking parlour roof',
  latDeg: `46°30'00"N`,
  lonDeg: '3.25 E',
  altitudeM: '',
  serviceProfileId: String(world.serviceId),
  dishIds: world.dishIds.join(','),
  targetAvailabilityPercent: '99.9',
  ...over,
});

async function created(input: Record<string, unknown>) {
  const out = await callAction(studyActions.createStudy, input);
  expect(out.state).toMatchObject({ ok: true });
  const id = (out.state as { data: { id: number } }).data.id;
  const study = await getStudy(company.id, id);
  return { id, study: study! };
}

/** The study page rendered by its real server component, as plain text. */
async function pageText(id: number): Promise<string> {
  const page = await callPage(() => StudyPage({ params: Promise.resolve({ id: String(id) }) }));
  if (!('value' in page)) throw new Error(`study page did not render: ${JSON.stringify(page)}`);
  return renderToStaticMarkup(page.value)
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#x27;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ');
}

describe('a study from coordinates alone', () => {
  it('reads the rain climate, the altitude (P.1511-1, with its source) and the atmosphere from the ITU-R maps', async () => {
    asUser(installer);
    const { id, study } = await created(newSiteStudy());
    const atSite = siteClimate(SITE);
    expect(study.climateProfileId).toBeNull();
    expect(study.inputs.climate).toMatchObject({ id: null, kind: 'itu-r-maps', name: "From the site's coordinates (ITU-R maps)" });
    expect(study.result.tradeoff.climateSource.kind).toBe('itu-r-maps');
    expect(study.result.tradeoff.climateSource.r001MmH).toBeCloseTo(atSite.r001MmH, 9);
    expect(study.result.tradeoff.rainHeightKm).toBeCloseTo(atSite.rainHeightKm, 9);

    // The blank altitude is the P.1511-1 ground height, stored with its source on the site and in the study.
    const altitude = mapsAltitudeM(SITE.latDeg, SITE.lonDeg);
    expect(altitude).toBeGreaterThan(100);
    const site = await models().Site.findByPk(study.siteId!);
    expect([site!.altitudeM, site!.altitudeSource]).toEqual([altitude.toFixed(1), 'itu-r-p1511-1']);
    expect(study.inputs.site).toMatchObject({ altitudeM: altitude, altitudeSource: 'itu-r-p1511-1' });
    expect(study.inputs.scenario.site.altitudeKm).toBeCloseTo(altitude / 1000, 12);

    // Gases, clouds and scintillation too: every outage is on the P.618-14 §2.5 total.
    expect(study.inputs.siteMaps).toMatchObject({ mapDataVersion: MAP_DATA_VERSION, isothermUsed: true });
    expect(study.result.tradeoff.attenuationModel).toBe('total');
    for (const o of study.result.tradeoff.options) {
      expect(o.attenuationAtOutage!.totalDb).toBeCloseTo(o.fadeThresholdDb!, 6);
      expect(o.attenuationAtOutage!.gasDb).toBeGreaterThan(0);
    }
    const curve = study.result.exceedanceCurve;
    expect(curve).toHaveLength(41);
    expect(curve.every((p) => p.rainDb !== undefined && p.attenuationDb > p.rainDb)).toBe(true);

    const text = await pageText(id);
    expect(text).toContain('Climate at the site');
    expect(text).toMatch(/Rain rate exceeded 0\.01 % of the year \(R0\.01\) [\d.]+ mm\/h ITU-R P\.837-7 Annex 1 · from the ITU-R maps at the site/);
    expect(text).toMatch(/Rain height hR [\d.]+ km ITU-R P\.839-4: h0 \+ 0\.36 km · from the ITU-R maps at the site/);
    expect(text).toMatch(new RegExp(`Station altitude ${altitude} m ITU-R P\\.1511-1 · from the ITU-R maps at the site`));
    expect(text).toContain('ITU-R P.1511-1 map at the site');
    expect(text).toMatch(/Wet refractivity N_wet \(median\) [\d.]+ ITU-R P\.453-14/);
    expect(text).toContain(`Map data version ${MAP_DATA_VERSION}`);
    expect(text).toContain('Attenuation at outage, by cause');
    expect(text).toContain('= fade threshold');
    expect(text).toContain('Statistics, not guarantees');
    expect(text).toContain('not a guarantee for any one year');
    expect(text).not.toContain('made for');
  });

  it('a typed altitude is the user’s, and the map’s figure is shown beside it', async () => {
    asUser(installer);
    const { id, study } = await created(newSiteStudy({ altitudeM: '220' }));
    expect(study.inputs.site).toMatchObject({ altitudeM: 220, altitudeSource: 'user' });
    const site = await models().Site.findByPk(study.siteId!);
    expect(site!.altitudeSource).toBe('user');
    expect(await pageText(id)).toContain(`entered for the site (the map gives ${mapsAltitudeM(SITE.latDeg, SITE.lonDeg)} m)`);
  });
});

describe('a company profile overrides the rain climate only', () => {
  it('made for a place far from the site: the study warns and states the distance', async () => {
    asUser(admin);
    const name = `Gauge on the far coast ${suffix()}`;
    const made = await callAction(climateActions.createClimateProfile, { name, kind: 'known-r001', r001MmH: '41', sourceNote: 'invented gauge', latDeg: `49°06'N`, lonDeg: '22.4 W' });
    expect(made.state).toMatchObject({ ok: true });
    const profileId = (made.state as { data: { id: number } }).data.id;
    const row = await models().ClimateProfile.findByPk(profileId);
    expect([row!.latDeg, row!.lonDeg]).toEqual(['49.10000', '-22.40000']);

    asUser(installer);
    const { id, study } = await created(newSiteStudy({ climateProfileId: String(profileId) }));
    expect(study.climateProfileId).toBe(profileId);
    expect(study.inputs.climate).toMatchObject({ kind: 'known-r001', location: { latDeg: 49.1, lonDeg: -22.4 } });
    expect(study.result.tradeoff.climateSource.r001MmH).toBe(41);
    // No h0 in the profile: the P.839-4 map value at the site, not the latitude approximation.
    expect(study.result.tradeoff.rainHeightSource).toBe('zero-isotherm');
    expect(study.result.tradeoff.rainHeightKm).toBeCloseTo(siteClimate(SITE).rainHeightKm, 9);
    // Gases, clouds and scintillation still from the maps.
    expect(study.result.tradeoff.attenuationModel).toBe('total');

    const km = greatCircleKm({ latDeg: 46.5, lonDeg: 3.25 }, { latDeg: 49.1, lonDeg: -22.4 });
    expect(km).toBeGreaterThan(1500);
    expect(climatePlaceOf(study.inputs.site, study.inputs.climate)).toEqual({ kind: 'far', distanceKm: km });
    const text = await pageText(id);
    expect(text).toContain('Rain climate made for somewhere else');
    expect(text).toContain(`was made for a place ${Math.round(km).toLocaleString('en-US')} km from this site`);
    expect(text).toMatch(new RegExp(`R0\\.01\\) 41\\.0 mm/h given in the profile · from profile “${name}”`));
    expect(text).toMatch(/0 °C isotherm height h0 [\d.]+ km ITU-R P\.839-4 · from the ITU-R maps at the site/);
  });

  it('an uploaded measured curve keeps the place it was measured for', async () => {
    asUser(admin);
    const file = new File(['p_percent,rain_rate_mm_h\n1,2.5\n0.1,11\n0.01,34\n0.001,70\n'], 'gauge.csv', { type: 'text/csv' });
    const out = await callAction(confirmClimateUpload, { kind: 'rain-curve', file, name: `Quay gauge ${suffix()}`, sourceNote: 'invented gauge', latDeg: `47°54'N`, lonDeg: '20.74 W' });
    expect(out.state).toMatchObject({ ok: true });
    const id = (out.state as { data: { climateProfileId: number } }).data.climateProfileId;
    const row = await models().ClimateProfile.findByPk(id);
    expect([row!.kind, row!.latDeg, row!.lonDeg]).toEqual(['measured-curve', '47.90000', '-20.74000']);
    // Half a place is refused, naming the missing box; nothing is saved.
    const half = await callAction(confirmClimateUpload, { kind: 'rain-curve', file, name: 'Half a place', sourceNote: 'invented', latDeg: '47.9' });
    expect(half.state).toMatchObject({ ok: false, fieldErrors: { lonDeg: ['Give the longitude too, or leave both blank.'] } });
  });

  it('made nearby: no warning; with no place stored: "made for an unknown place"', async () => {
    asUser(admin);
    const near = await callAction(climateActions.createClimateProfile, { name: `Parlour gauge ${suffix()}`, kind: 'known-r001', r001MmH: '33', sourceNote: 'invented', latDeg: '46.6', lonDeg: '3.3', zeroIsothermKm: '2.7' });
    const nearId = (near.state as { data: { id: number } }).data.id;
    asUser(installer);
    const a = await created(newSiteStudy({ climateProfileId: String(nearId) }));
    expect(climatePlaceOf(a.study.inputs.site, a.study.inputs.climate)?.kind).toBe('near');
    // The profile's own h0 wins.
    expect(a.study.result.tradeoff.rainHeightKm).toBeCloseTo(2.7 + 0.36, 9);
    const nearText = await pageText(a.id);
    expect(nearText).not.toContain('Rain climate made for');
    expect(nearText).toMatch(/made for a place 12 km from the site/);

    // The world's profile was made without a place.
    const b = await created(newSiteStudy({ climateProfileId: String(world.climateId) }));
    expect(b.study.inputs.climate.location).toBeNull();
    const text = await pageText(b.id);
    expect(text).toContain('Rain climate made for an unknown place');
  });
});

describe('clear errors, never a 500 or a number', () => {
  it('a site with no ITU-R map data (88.9° N) is a 422 on the latitude, and nothing is left behind', async () => {
    asUser(installer);
    const [customers, sites, studies] = [await countRows('customers', company.id), await countRows('sites', company.id), await countRows('studies', company.id)];
    const out = await callAction(studyActions.createStudy, newSiteStudy({ latDeg: '88.9', lonDeg: '45' }));
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { latDeg: [expect.stringMatching(/The ITU-R maps have no climate data at this site \(latitude 88\.9°\)/)] } });
    expect([await countRows('customers', company.id), await countRows('sites', company.id), await countRows('studies', company.id)]).toEqual([customers, sites, studies]);
  });

  it('a picked site with no map data names the site box', async () => {
    asUser(installer);
    const polar = await createSite(company.id, world.customerId, { name: 'Polar mast', latDeg: 88.9, lonDeg: 45, altitudeM: 0 });
    const out = await callAction(studyActions.createStudy, { customerId: String(world.customerId), siteId: String(polar.id), serviceProfileId: String(world.serviceId), dishIds: String(world.dishIds[0]) });
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { siteId: [expect.stringMatching(/no climate data/)] } });
  });

  it('a satellite below the horizon with the default climate is a 422 on the service', async () => {
    asUser(installer);
    const { createServiceProfile } = await import('@/db/queries/service-profiles');
    const { serviceProfileSchema } = await import('@/server/validation/service-profile');
    const { TEST_SERVICE_FORM } = await import('./studies-fixtures');
    const far = await createServiceProfile(company.id, serviceProfileSchema.parse({ ...TEST_SERVICE_FORM, name: `Far side ${suffix()}`, satelliteLongitudeDeg: '150 E' }));
    const out = await callAction(studyActions.createStudy, newSiteStudy({ serviceProfileId: String(far.id) }));
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { serviceProfileId: [expect.stringMatching(/below the horizon/)] } });
  });

  it('a site form with a blank altitude takes the map’s; typing one makes it the user’s again', async () => {
    asUser(installer);
    const out = await callAction(siteActions.createSite, { customerId: String(world.customerId), name: 'Hay loft', latDeg: '46.5', lonDeg: '3.25', altitudeM: '' });
    expect(out.state).toMatchObject({ ok: true, message: expect.stringContaining('from the ITU-R P.1511-1 map') });
    const id = (out.state as { data: { id: number } }).data.id;
    const altitude = mapsAltitudeM(46.5, 3.25);
    expect((await models().Site.findByPk(id))!.altitudeSource).toBe('itu-r-p1511-1');
    expect(await callAction(siteActions.updateSite, { id: String(id), customerId: String(world.customerId), name: 'Hay loft', latDeg: '46.5', lonDeg: '3.25', altitudeM: '300' })).toMatchObject({ state: { ok: true } });
    let row = await models().Site.findByPk(id);
    expect([row!.altitudeM, row!.altitudeSource]).toEqual(['300.0', 'user']);
    // Blank again after moving the site: the map's height at the new coordinates.
    await callAction(siteActions.updateSite, { id: String(id), customerId: String(world.customerId), name: 'Hay loft', latDeg: '48.612', lonDeg: '-21.847', altitudeM: '' });
    row = await models().Site.findByPk(id);
    expect([row!.altitudeM, row!.altitudeSource]).toEqual([mapsAltitudeM(48.612, -21.847).toFixed(1), 'itu-r-p1511-1']);
    expect(altitude).not.toBe(mapsAltitudeM(48.612, -21.847));
  });
});

describe('re-runs and older studies', () => {
  it('a study on the maps re-runs on the maps', async () => {
    asUser(installer);
    const { id } = await created(newSiteStudy());
    const rerun = await callAction(studyActions.rerunStudy, { id: String(id) });
    expect(rerun.state).toMatchObject({ ok: true, data: { revision: 2 } });
    const fresh = await getStudy(company.id, (rerun.state as { data: { id: number } }).data.id);
    expect(fresh!.climateProfileId).toBeNull();
    expect(fresh!.inputs.climate.kind).toBe('itu-r-maps');
    expect(fresh!.result.tradeoff.attenuationModel).toBe('total');
  });

  it('a study whose override profile was deleted is refused with a clear conflict, not re-run on another climate', async () => {
    asUser(admin);
    const made = await callAction(climateActions.createClimateProfile, { name: `Short-lived ${suffix()}`, kind: 'climate-zone', zone: 'K', sourceNote: 'invented' });
    const profileId = (made.state as { data: { id: number } }).data.id;
    asUser(installer);
    const { id } = await created(newSiteStudy({ climateProfileId: String(profileId) }));
    asUser(admin);
    expect((await callAction(climateActions.deleteClimateProfile, { id: String(profileId) })).state).toMatchObject({ ok: true });
    asUser(installer);
    expect((await callAction(studyActions.rerunStudy, { id: String(id) })).state).toMatchObject({ ok: false, code: 'conflict', error: expect.stringMatching(/climate profile of this study has been deleted/) });
  });

  it('a study stored before the site’s own climate renders as before and re-runs onto the total', async () => {
    const { Customer, Site, ServiceProfile, ClimateProfile, Dish, sequelize } = models();
    const [customer, site, service, climate, dishes] = await Promise.all([
      Customer.findByPk(world.customerId),
      Site.findByPk(world.siteId),
      ServiceProfile.findByPk(world.serviceId),
      ClimateProfile.findByPk(world.climateId),
      Dish.findAll({ where: { id: world.dishIds } }),
    ]);
    // The snapshot as the previous release wrote it: rain only, none of the new keys.
    const { altitudeSource: _a, ...oldSite } = siteSnapshotOf(site!, customer!.name);
    const { location: _l, ...oldClimate } = climateSnapshotOf(climate!);
    const built = buildScenario({ site: oldSite, service: serviceSnapshotOf(service!), climate: oldClimate, dishes: dishes.map(dishSnapshotOf), targetAvailabilityPercent: 99.9 });
    const { attenuationModel: _m, atmosphere: _at, ...tradeoff } = dishTradeoff(built.scenario);
    const oldTradeoff = { ...tradeoff, options: tradeoff.options.map(({ attenuationAtOutage: _x, ...o }) => o) };
    const inputs = { schemaVersion: 1, site: oldSite, service: serviceSnapshotOf(service!), climate: oldClimate, dishes: built.dishes, targetAvailabilityPercent: 99.9, downlinkTiltDeg: built.downlinkTiltDeg, scenario: built.scenario } as StudyInputsSnapshot;
    const result = { schemaVersion: 1, engineVersion: '0.9.0', computedAt: new Date().toISOString(), tradeoff: oldTradeoff, exceedanceCurve: exceedanceCurve(inputs, tradeoff) } as unknown as StudyResultSnapshot;
    const id = await sequelize.transaction((t) =>
      insertStudy(company.id, { customerId: customer!.id, siteId: site!.id, serviceProfileId: service!.id, climateProfileId: climate!.id, revisionOfStudyId: null, revision: 1, title: `Old study ${suffix()}`, customerName: customer!.name, siteName: site!.name, serviceName: service!.name, recommendedDiameterM: null, inputs, result, createdByUserId: null }, t),
    );

    asUser(installer);
    const text = await pageText(id);
    expect(text).toContain('Rain climate Profile Known R0.01 (test) · Known R0.01');
    expect(text).toContain('Link budget and rain outage for each dish');
    expect(text).toContain('Rain attenuation exceeded against the percentage of the year');
    expect(text).not.toContain('Climate at the site');
    expect(text).not.toContain('Attenuation at outage, by cause');
    expect(text).not.toContain('Rain climate made for');

    const rerun = await callAction(studyActions.rerunStudy, { id: String(id) });
    expect(rerun.state).toMatchObject({ ok: true, data: { revision: 2 } });
    const fresh = await getStudy(company.id, (rerun.state as { data: { id: number } }).data.id);
    expect(fresh!.result.tradeoff.attenuationModel).toBe('total');
    expect(fresh!.inputs.climate).toMatchObject({ kind: 'known-r001', location: null });
  });
});
