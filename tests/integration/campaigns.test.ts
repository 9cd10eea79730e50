import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { dishTradeoff } from '@/server/engine';
import { computeUpgradeCampaign } from '@/server/actions/campaigns';
import type { CampaignResponse } from '@/server/campaigns/run-campaign';
import { buildScenario } from '@/server/studies/build-scenario';
import { mapsAtmosphere, mapsClimateSnapshot } from '@/server/studies/maps-climate';
import { siteClimate } from '@/server/climate-maps';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf } from '@/server/studies/snapshot-of';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { countRows, createStudyWorld, type StudyWorld } from './studies-fixtures';

/**
 * Upgrade campaigns against the real MariaDB: a small campaign computed by the action agrees with
 * a direct dishTradeoff on the same scenario, each site on its own climate from the ITU-R maps (a
 * company profile only as a stated override of the rain climate); bad rows are listed by line and
 * the others go on; sales are refused; the plan's monthly upload limit is checked; nothing is stored.
 */
afterAll(closeSequelize);

let company: TestCompany;
let world: StudyWorld;
let adminToken: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(company.id);
  adminToken = await signInAs(await createUserWithRole(company.id, 'admin'));
});

// Invented site references and coordinates (demo data). The study world has 60, 90 and 120 cm dishes.
const HEADER = 'site_ref,latitude,longitude,altitude_m,current_dish_cm';
const FILE = [HEADER, 'CAMP-1,47.5,2.25,120,60', 'CAMP-2,47°30\'00" N,bad,120,60', 'CAMP-3,47.5,2.25,120,75', 'CAMP-4,-75,150,0,60', 'CAMP-5,47.5,2.25,120,120', 'CAMP-6,88.9,100,0,60'].join('\n') + '\n';
const file = (text: string) => new File([text], 'spring-campaign.csv', { type: 'text/csv' });
/** The form's default rain climate is 'maps' (each site's own); a profile id is an override. */
const input = (text: string, over: Record<string, unknown> = {}) => ({ file: file(text), serviceProfileId: String(world.serviceId), climateProfileId: 'maps', targetAvailabilityPercent: '99.95', ...over });

describe('computeUpgradeCampaign', () => {
  it('computes each site like a direct dishTradeoff on the same scenario and lists bad rows by line', async () => {
    asUser(adminToken);
    const before = { uploads: await countRows('uploads', company.id), studies: await countRows('studies', company.id), sites: await countRows('sites', company.id) };
    const out = await callAction(computeUpgradeCampaign, input(FILE));
    expect(out.state).toMatchObject({ ok: true });
    const data = (out.state as { data: CampaignResponse }).data;
    expect(data.counts).toMatchObject({ rows: 6, computed: 2, problems: 4 });
    expect(data.climateOverride).toBe(false);
    expect(data.climateName).toBe("From each site's coordinates (ITU-R maps)");
    expect(data.problems.map((p) => p.line)).toEqual([3, 4, 5, 7]);
    expect(data.problems[0].message).toMatch(/^Line 3, longitude:/);
    expect(data.problems[1].message).toContain('no active catalogue dish is 75 cm');
    expect(data.problems[2].message).toContain('below the horizon');
    expect(data.problems[3].message).toMatch(/^Line 7: the ITU-R maps have no climate data at these coordinates/);

    // The same scenario built directly from the company's rows and the maps at the site, through the engine.
    const { ServiceProfile, Dish } = models();
    const [service, dishes] = await Promise.all([ServiceProfile.findByPk(world.serviceId), Dish.findAll({ where: { companyId: company.id, active: true } })]);
    const built = buildScenario({
      site: { id: null, name: 'CAMP-1', customerId: null, customerName: '', latDeg: 47.5, lonDeg: 2.25, altitudeM: 120 },
      service: serviceSnapshotOf(service!),
      climate: mapsClimateSnapshot(47.5, 2.25),
      dishes: dishes.map(dishSnapshotOf),
      targetAvailabilityPercent: 99.95,
      atmosphere: mapsAtmosphere(47.5, 2.25, 0.12),
    });
    const direct = dishTradeoff(built.scenario);
    expect(direct.attenuationModel).toBe('total');
    const row = data.results.find((r) => r.siteRef === 'CAMP-1')!;
    expect(row.line).toBe(2);
    expect(row.climate).toMatchObject({ r001MmH: siteClimate({ latDeg: 47.5, lonDeg: 2.25 }).r001MmH, altitudeM: 120, altitudeSource: 'file' });
    expect(row.currentAttenuation).toEqual(direct.options[0].attenuationAtOutage);
    expect(row.currentDishCm).toBe(60);
    expect(row.currentOutageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
    expect(row.currentAvailabilityPercent).toBe(direct.options[0].availabilityPercent);
    // With this invented service and the site's climate the 60 cm dish misses 99.95 % and a larger one meets it.
    const rec = direct.recommendation.smallestMeetingTargetIndex;
    expect(direct.options[0].meetsTarget).toBe(false);
    expect(rec).not.toBeNull();
    expect(row.verdict).toBe('upgrade');
    expect(row.recommendedDishCm).toBe(Math.round(direct.options[rec!].diameterM * 100));
    expect(row.recommendedOutageMinutesPerYear).toBe(direct.options[rec!].outageMinutesPerYear);
    expect(row.minutesSavedPerYear).toBeCloseTo(direct.options[0].outageMinutesPerYear - direct.options[rec!].outageMinutesPerYear, 9);
    expect(row.upgradePriceUsd).toBe(direct.options[rec!].priceUsd);
    expect(data.results.find((r) => r.siteRef === 'CAMP-5')!.verdict).toBe(direct.options[2].meetsTarget ? 'already-meets-target' : 'none-meets-target');

    // The download: a header naming units, one line per site or problem.
    const csv = Papa.parse<string[]>(data.csv.trim()).data;
    expect(csv[0]).toContain('current_outage_min_per_year');
    expect(csv[0]).toContain('upgrade_price_usd');
    expect(csv[0]).toEqual(expect.arrayContaining(['r001_mm_h', 'rain_climate_source', 'rain_height_km', 'altitude_m_used', 'altitude_source', 'current_outage_gas_db', 'current_outage_total_db']));
    expect(csv).toHaveLength(1 + 6);
    expect(data.csvFilename).toBe('spring-campaign-upgrades.csv');

    // Stateless: nothing written.
    expect({ uploads: await countRows('uploads', company.id), studies: await countRows('studies', company.id), sites: await countRows('sites', company.id) }).toEqual(before);
  });

  it('a climate profile overrides the rain climate of every site, and says so', async () => {
    asUser(adminToken);
    const out = await callAction(computeUpgradeCampaign, input(FILE, { climateProfileId: String(world.climateId) }));
    expect(out.state).toMatchObject({ ok: true });
    const data = (out.state as { data: CampaignResponse }).data;
    expect(data.climateOverride).toBe(true);
    expect(data.climateName).toBe('Known R0.01 (test)');
    const { ServiceProfile, ClimateProfile, Dish } = models();
    const [service, climate, dishes] = await Promise.all([ServiceProfile.findByPk(world.serviceId), ClimateProfile.findByPk(world.climateId), Dish.findAll({ where: { companyId: company.id, active: true } })]);
    const direct = dishTradeoff(
      buildScenario({
        site: { id: null, name: 'CAMP-1', customerId: null, customerName: '', latDeg: 47.5, lonDeg: 2.25, altitudeM: 120 },
        service: serviceSnapshotOf(service!),
        climate: climateSnapshotOf(climate!),
        dishes: dishes.map(dishSnapshotOf),
        targetAvailabilityPercent: 99.95,
        atmosphere: mapsAtmosphere(47.5, 2.25, 0.12),
      }).scenario,
    );
    const row = data.results.find((r) => r.siteRef === 'CAMP-1')!;
    expect(row.climate).toMatchObject({ r001MmH: 32, rainClimateSource: 'climate profile "Known R0.01 (test)" (override)' });
    expect(row.currentOutageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
    expect(data.csv).toContain('climate profile ""Known R0.01 (test)"" (override)');
  });

  it('a blank climate choice is the default too; another company’s profile as override is not found', async () => {
    asUser(adminToken);
    expect((await callAction(computeUpgradeCampaign, input(FILE, { climateProfileId: '' }))).state).toMatchObject({ ok: true, data: { climateOverride: false } });
    const other = await createCompany();
    const otherWorld = await createStudyWorld(other.id);
    expect((await callAction(computeUpgradeCampaign, input(FILE, { climateProfileId: String(otherWorld.climateId) }))).state).toMatchObject({ ok: false, code: 'not_found' });
  });

  it('refuses a file with a missing column, naming it', async () => {
    asUser(adminToken);
    const out = await callAction(computeUpgradeCampaign, input('site_ref,latitude,longitude,altitude_m\nA,47,2,100\n'));
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', error: expect.stringContaining('current_dish_cm') });
  });

  it('another company’s service profile is not found', async () => {
    const other = await createCompany();
    const otherWorld = await createStudyWorld(other.id);
    asUser(adminToken);
    const out = await callAction(computeUpgradeCampaign, input(FILE, { serviceProfileId: String(otherWorld.serviceId) }));
    expect(out.state).toMatchObject({ ok: false, code: 'not_found' });
  });
});

describe('roles', () => {
  it('an installer may run a campaign; sales may not', async () => {
    asUser(await signInAs(await createUserWithRole(company.id, 'installer')));
    expect((await callAction(computeUpgradeCampaign, input(FILE))).state).toMatchObject({ ok: true });
    asUser(await signInAs(await createUserWithRole(company.id, 'sales')));
    expect((await callAction(computeUpgradeCampaign, input(FILE))).state).toMatchObject({ ok: false, code: 'forbidden' });
  });
});

describe('the plan’s upload limit', () => {
  it('is checked: at the monthly upload limit (bench: 2 a month) a campaign is refused, naming the limit', async () => {
    const small = await createCompany({ planCode: 'bench' });
    const smallWorld = await createStudyWorld(small.id);
    asUser(await signInAs(await createUserWithRole(small.id, 'admin')));
    const campaign = () => ({ file: file(FILE), serviceProfileId: String(smallWorld.serviceId), targetAvailabilityPercent: '99.9' });
    expect((await callAction(computeUpgradeCampaign, campaign())).state).toMatchObject({ ok: true });
    for (const n of [1, 2]) {
      await models().Upload.create({ companyId: small.id, kind: 'dish-catalogue', originalFilename: `u${n}.csv`, originalBytes: Buffer.from('x'), sizeBytes: 1, parseReport: { kind: 'dish-catalogue', summary: 'test', rowCount: 0 }, createdByUserId: null });
    }
    const refused = await callAction(computeUpgradeCampaign, campaign());
    expect(refused.state).toMatchObject({ ok: false, code: 'plan_limit', error: expect.stringMatching(/allows 2 uploads a month/) });
  });
});
