import { models } from '@/db/models';
import { createCustomer } from '@/db/queries/customers';
import { createSite } from '@/db/queries/sites';
import { createServiceProfile } from '@/db/queries/service-profiles';
import { createClimateProfile } from '@/db/queries/climate-profiles';
import { createDish } from '@/db/queries/dishes';
import { serviceProfileSchema } from '@/server/validation/service-profile';
import { suffix } from './support/factories';
import { computeStudy } from '@/server/studies/compute-study';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf, siteSnapshotOf } from '@/server/studies/snapshot-of';
import { insertStudy } from '@/db/queries/studies';
import { recommendedDiameterOf } from '@/server/studies/create-study';

/**
 * A small invented world for study tests: one customer with one site, one service on an invented
 * satellite, one known-R0.01 climate and three dishes. Everything goes through the named queries.
 */
export type StudyWorld = { customerId: number; siteId: number; serviceId: number; climateId: number; dishIds: number[] };

export const TEST_SERVICE_FORM = {
  name: 'Test TV bouquet',
  satelliteName: 'Testbird-1',
  satelliteLongitudeDeg: '19.5 W',
  downlinkFrequencyGHz: '11.75',
  polarization: 'linear-horizontal',
  eirpDbw: '50',
  symbolRateMsps: '27.5',
  modcod: '8PSK 3/4',
  implementationMarginDb: '1',
  lnbNoiseTempK: '60',
  antennaNoiseTempK: '40',
};

export async function createStudyWorld(companyId: number): Promise<StudyWorld> {
  const customer = await createCustomer(companyId, { name: `Fenwold Farm ${suffix()}`, email: null, phone: null, notes: null });
  const site = await createSite(companyId, customer.id, { name: 'Long barn roof', latDeg: 47.123456, lonDeg: 2.654321, altitudeM: 140 });
  const service = await createServiceProfile(companyId, serviceProfileSchema.parse(TEST_SERVICE_FORM));
  const climate = await createClimateProfile(companyId, { name: 'Known R0.01 (test)', kind: 'known-r001', data: { r001MmH: 32 }, zeroIsothermKm: 2.9, sourceNote: 'invented for tests' });
  const dishes = [];
  for (const [cm, price] of [[60, '89.00'], [90, '189.00'], [120, '329.00']] as const) {
    dishes.push(await createDish(companyId, { name: `Test ${cm} cm ${suffix()}`, diameterM: cm / 100, efficiency: 0.65, hardwarePrice: price, labourPrice: '95.00', mountNotes: null, active: true }));
  }
  return { customerId: customer.id, siteId: site.id, serviceId: service.id, climateId: climate.id, dishIds: dishes.map((d) => d.id) };
}

export async function countRows(table: string, companyId: number): Promise<number> {
  const { sequelize } = models();
  const [rows] = (await sequelize.query(`SELECT COUNT(*) AS n FROM \`${table}\` WHERE company_id = ?`, { replacements: [companyId] })) as [{ n: number }[], unknown];
  return Number(rows[0].n);
}

/**
 * A study stored directly (computed by the real engine, written by the named query) without the
 * plan's monthly study limit: for tests that need a study to exist, not to test creating one.
 */
export async function insertTestStudy(companyId: number, userId: string | null, w: StudyWorld, title = `Test study ${suffix()}`): Promise<number> {
  const { Customer, Site, ServiceProfile, ClimateProfile, Dish, sequelize } = models();
  const [customer, site, service, climate, dishes] = await Promise.all([
    Customer.findByPk(w.customerId),
    Site.findByPk(w.siteId),
    ServiceProfile.findByPk(w.serviceId),
    ClimateProfile.findByPk(w.climateId),
    Dish.findAll({ where: { id: w.dishIds } }),
  ]);
  const { inputs, result } = computeStudy({
    site: siteSnapshotOf(site!, customer!.name),
    service: serviceSnapshotOf(service!),
    climate: climateSnapshotOf(climate!),
    dishes: dishes.map(dishSnapshotOf),
    targetAvailabilityPercent: 99.9,
  });
  return sequelize.transaction((t) =>
    insertStudy(companyId, {
      customerId: customer!.id, siteId: site!.id, serviceProfileId: service!.id, climateProfileId: climate!.id, revisionOfStudyId: null, revision: 1,
      title, customerName: customer!.name, siteName: site!.name, serviceName: service!.name, recommendedDiameterM: recommendedDiameterOf(result),
      inputs, result, createdByUserId: userId,
    }, t),
  );
}
