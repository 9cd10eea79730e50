import type { QueryInterface, Transaction } from 'sequelize';
import { models } from '../models';
import { serviceProfileSchema } from '../../server/validation/service-profile';
import { climateProfileSchema } from '../../server/validation/climate';
import { computeStudy } from '../../server/studies/compute-study';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf, siteSnapshotOf } from '../../server/studies/snapshot-of';
import { DEMO_COMPANIES, DEMO_USERS } from '../demo/accounts';
import { BRAMBLECOTE_DEMO, DEMO_CLIMATES, DEMO_CUSTOMERS, DEMO_DISHES, DEMO_SERVICES, DEMO_STUDIES } from '../demo/studies';

type Ctx = { context: QueryInterface };

/**
 * The invented studies scenario (db/demo/studies.ts) for `npm start` and the browser tests:
 * Quillfeather's customers, sites, two services, dish catalogue, a climate profile of each kind
 * (each with the invented place it was made for) and studies computed through the real engine —
 * on the ITU-R maps at the site, or with a profile as a rain-climate override; a little of the
 * same for Bramblecote.
 */
async function companyId(name: string, t: Transaction): Promise<number> {
  const row = await models().Company.findOne({ where: { name }, order: [['id', 'DESC']], transaction: t });
  if (!row) throw new Error(`demo company "${name}" is missing: run the account seeder first`);
  return row.id;
}

async function userId(email: string, t: Transaction): Promise<string | null> {
  return (await models().User.findOne({ where: { email }, transaction: t }))?.id ?? null;
}

async function addService(cid: number, form: Record<string, string>, t: Transaction) {
  const s = serviceProfileSchema.parse(form);
  return models().ServiceProfile.create(
    {
      companyId: cid,
      name: s.name,
      satelliteName: s.satelliteName,
      satelliteLongitudeDeg: s.satelliteLongitudeDeg.toFixed(2),
      downlinkFrequencyGhz: s.downlinkFrequencyGHz.toFixed(4),
      polarization: s.polarization,
      polarizationTiltDeg: s.polarizationTiltDeg.toFixed(2),
      eirpDbw: s.eirpDbw.toFixed(2),
      symbolRateMsps: s.symbolRateMsps.toFixed(4),
      modcod: s.modcod,
      requiredEsN0Db: s.requiredEsN0Db.toFixed(2),
      implementationMarginDb: s.implementationMarginDb.toFixed(2),
      otherLossesDb: s.otherLossesDb.toFixed(2),
      lnbNoiseTempK: s.lnbNoiseTempK.toFixed(1),
      antennaNoiseTempK: s.antennaNoiseTempK.toFixed(1),
      uplink: s.uplink,
      acmModcods: s.acmModcods,
      notes: s.notes,
    },
    { transaction: t },
  );
}

type DemoClimate = { name: string; kind: string; data: unknown; zeroIsothermKm: number | null; sourceNote: string; location: { latDeg: number; lonDeg: number } | null };

async function addClimate(cid: number, c: DemoClimate, t: Transaction) {
  const { location, ...rest } = c;
  const v = climateProfileSchema.parse({ ...rest, zeroIsothermKm: c.zeroIsothermKm ?? undefined, latDeg: location?.latDeg, lonDeg: location?.lonDeg });
  return models().ClimateProfile.create(
    {
      companyId: cid,
      name: v.name,
      kind: v.kind,
      data: v.data,
      zeroIsothermKm: v.zeroIsothermKm === undefined ? null : v.zeroIsothermKm.toFixed(3),
      sourceNote: v.sourceNote,
      latDeg: v.latDeg === undefined ? null : v.latDeg.toFixed(5),
      lonDeg: v.lonDeg === undefined ? null : v.lonDeg.toFixed(5),
      uploadId: null,
    },
    { transaction: t },
  );
}

async function addDishes(cid: number, rows: readonly (readonly string[])[], t: Transaction) {
  const out = [];
  for (const [name, diameterM, efficiency, hardwarePrice, labourPrice, mountNotes] of rows) {
    out.push(await models().Dish.create({ companyId: cid, name, diameterM, efficiency, hardwarePrice, labourPrice, mountNotes, active: true }, { transaction: t }));
  }
  return out;
}

async function addStudy(
  cid: number,
  o: { title: string; customer: { id: number; name: string }; site: Awaited<ReturnType<ReturnType<typeof models>['Site']['create']>>; service: Awaited<ReturnType<typeof addService>>; climate: Awaited<ReturnType<typeof addClimate>> | null; dishes: Awaited<ReturnType<typeof addDishes>>; target: number; userId: string | null; createdAt: Date },
  t: Transaction,
) {
  const { inputs, result } = computeStudy({
    site: siteSnapshotOf(o.site, o.customer.name),
    service: serviceSnapshotOf(o.service),
    climate: o.climate ? climateSnapshotOf(o.climate) : null,
    dishes: o.dishes.map(dishSnapshotOf),
    targetAvailabilityPercent: o.target,
    now: o.createdAt,
  });
  const i = result.tradeoff.recommendation.smallestMeetingTargetIndex;
  await models().Study.create(
    {
      companyId: cid,
      customerId: o.customer.id,
      siteId: o.site.id,
      serviceProfileId: o.service.id,
      climateProfileId: o.climate?.id ?? null,
      revisionOfStudyId: null,
      revision: 1,
      title: o.title,
      customerName: o.customer.name,
      siteName: o.site.name,
      serviceName: o.service.name,
      recommendedDiameterM: i === null ? null : result.tradeoff.options[i].diameterM.toFixed(3),
      dishCount: inputs.dishes.length,
      targetAvailabilityPercent: o.target.toFixed(4),
      inputs,
      result,
      engineVersion: result.engineVersion,
      createdByUserId: o.userId,
      createdAt: o.createdAt,
      updatedAt: o.createdAt,
    },
    { transaction: t },
  );
}

export async function up({ context: qi }: Ctx): Promise<void> {
  models();
  await qi.sequelize.transaction(async (t) => {
    // Quillfeather Dish & Signal
    const q = await companyId(DEMO_COMPANIES[0].name, t);
    const installer = await userId(DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!.email, t);
    const services = new Map<string, Awaited<ReturnType<typeof addService>>>();
    for (const s of DEMO_SERVICES) services.set(s.key, await addService(q, { ...s } as unknown as Record<string, string>, t));
    const climates = new Map<string, Awaited<ReturnType<typeof addClimate>>>();
    for (const c of DEMO_CLIMATES) climates.set(c.key, await addClimate(q, c as unknown as DemoClimate, t));
    const dishes = await addDishes(q, DEMO_DISHES, t);
    const customers = new Map<string, { id: number; name: string }>();
    const sites = new Map<string, Awaited<ReturnType<ReturnType<typeof models>['Site']['create']>>>();
    for (const c of DEMO_CUSTOMERS) {
      const row = await models().Customer.create({ companyId: q, name: c.name, email: c.email, phone: c.phone, notes: null }, { transaction: t });
      customers.set(c.key, { id: row.id, name: row.name });
      for (const s of c.sites) {
        const site = await models().Site.create(
          { companyId: q, customerId: row.id, name: s.name, address: s.address, latDeg: s.latDeg.toFixed(6), lonDeg: s.lonDeg.toFixed(6), altitudeM: s.altitudeM.toFixed(1), notes: null },
          { transaction: t },
        );
        sites.set(`${c.key}/${s.key}`, site);
      }
    }
    // Spread over the last weeks, oldest first, so the list and the dashboard read naturally.
    const now = Date.now();
    for (const [n, s] of DEMO_STUDIES.entries()) {
      await addStudy(
        q,
        {
          title: s.title,
          customer: customers.get(s.site.split('/')[0])!,
          site: sites.get(s.site)!,
          service: services.get(s.service)!,
          climate: s.climate === 'maps' ? null : climates.get(s.climate)!,
          dishes: dishes.filter((d) => (s.dishes as readonly string[]).includes(d.name)),
          target: s.target,
          userId: installer,
          createdAt: new Date(now - (DEMO_STUDIES.length - n) * 3 * 86_400_000),
        },
        t,
      );
    }

    // Bramblecote Aerials
    const b = await companyId(DEMO_COMPANIES[1].name, t);
    const bAdmin = await userId(DEMO_USERS.find((u) => u.company === 'bramblecote')!.email, t);
    const bd = BRAMBLECOTE_DEMO;
    const bCustomer = await models().Customer.create({ companyId: b, name: bd.customer.name, email: bd.customer.email, phone: null, notes: null }, { transaction: t });
    const bSite = await models().Site.create(
      { companyId: b, customerId: bCustomer.id, name: bd.site.name, address: bd.site.address, latDeg: bd.site.latDeg.toFixed(6), lonDeg: bd.site.lonDeg.toFixed(6), altitudeM: bd.site.altitudeM.toFixed(1), notes: null },
      { transaction: t },
    );
    const bService = await addService(b, { ...bd.service } as unknown as Record<string, string>, t);
    const bClimate = await addClimate(b, bd.climate as unknown as DemoClimate, t);
    const bDishes = await addDishes(b, bd.dishes, t);
    await addStudy(b, { title: bd.study.title, customer: { id: bCustomer.id, name: bCustomer.name }, site: bSite, service: bService, climate: bClimate, dishes: bDishes, target: bd.study.target, userId: bAdmin, createdAt: new Date(now - 86_400_000) }, t);
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.transaction(async (t) => {
    for (const c of DEMO_COMPANIES) {
      const row = await models().Company.findOne({ where: { name: c.name }, transaction: t });
      if (!row) continue;
      for (const table of ['studies', 'sites', 'customers', 'dishes', 'climate_profiles', 'service_profiles']) {
        await qi.bulkDelete(table, { company_id: row.id }, { transaction: t });
      }
    }
  });
}
