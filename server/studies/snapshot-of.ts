import type { ClimateProfile } from '@/db/models/climate-profile';
import type { Dish } from '@/db/models/dish';
import type { ServiceProfile } from '@/db/models/service-profile';
import type { Site } from '@/db/models/site';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot, SiteSnapshot } from './snapshot';
import { computeStudy } from './compute-study';

/** Database rows (exact decimal strings) → the plain snapshot a study keeps (numbers for physics, strings for money). */

export function siteSnapshotOf(site: Pick<Site, 'id' | 'name' | 'customerId' | 'latDeg' | 'lonDeg' | 'altitudeM' | 'altitudeSource'>, customerName: string): SiteSnapshot {
  return {
    id: site.id,
    name: site.name,
    customerId: site.customerId,
    customerName,
    latDeg: Number(site.latDeg),
    lonDeg: Number(site.lonDeg),
    altitudeM: Number(site.altitudeM),
    altitudeSource: site.altitudeSource ?? 'user',
  };
}

export function serviceSnapshotOf(s: ServiceProfile): ServiceSnapshot {
  return {
    id: s.id,
    name: s.name,
    satelliteName: s.satelliteName,
    satelliteLongitudeDeg: Number(s.satelliteLongitudeDeg),
    downlinkFrequencyGHz: Number(s.downlinkFrequencyGhz),
    polarization: s.polarization,
    polarizationTiltDeg: Number(s.polarizationTiltDeg),
    eirpDbw: Number(s.eirpDbw),
    symbolRateMsps: Number(s.symbolRateMsps),
    modcod: s.modcod,
    requiredEsN0Db: Number(s.requiredEsN0Db),
    implementationMarginDb: Number(s.implementationMarginDb),
    otherLossesDb: Number(s.otherLossesDb),
    lnbNoiseTempK: Number(s.lnbNoiseTempK),
    antennaNoiseTempK: Number(s.antennaNoiseTempK),
    uplink: jsonOf(s.uplink),
    acmModcods: jsonOf(s.acmModcods),
  };
}

export function climateSnapshotOf(c: ClimateProfile): ClimateSnapshot {
  return {
    id: c.id,
    name: c.name,
    kind: c.kind,
    data: jsonOf(c.data),
    zeroIsothermKm: c.zeroIsothermKm === null ? null : Number(c.zeroIsothermKm),
    sourceNote: c.sourceNote,
    // Recorded for every profile (null = unknown place), so the study can warn when it was made elsewhere.
    location: c.latDeg === null || c.latDeg === undefined || c.lonDeg === null || c.lonDeg === undefined ? null : { latDeg: Number(c.latDeg), lonDeg: Number(c.lonDeg) },
  };
}

export function dishSnapshotOf(d: Dish): DishSnapshot {
  return {
    dishId: d.id,
    name: d.name,
    diameterM: Number(d.diameterM),
    efficiency: Number(d.efficiency),
    hardwarePrice: d.hardwarePrice,
    labourPrice: d.labourPrice,
    mountNotes: d.mountNotes,
  };
}

/** MariaDB JSON columns are LONGTEXT: some read paths hand back the text. */
function jsonOf<T>(v: T | string): T {
  return typeof v === 'string' ? (JSON.parse(v) as T) : v;
}

/**
 * The study computed from this company's current rows (as a new study or a re-run takes them):
 * every row is copied into the snapshot first, so later edits of the rows never reach the study.
 */
export function computeStudyFromRows(o: {
  site: Site;
  customerName: string;
  service: ServiceProfile;
  /** An override profile of the rain climate; null = the ITU-R maps at the site (the default). */
  climate: ClimateProfile | null;
  dishes: Dish[];
  targetAvailabilityPercent: number;
}): ReturnType<typeof computeStudy> {
  return computeStudy({
    site: siteSnapshotOf(o.site, o.customerName),
    service: serviceSnapshotOf(o.service),
    climate: o.climate ? climateSnapshotOf(o.climate) : null,
    dishes: o.dishes.map(dishSnapshotOf),
    targetAvailabilityPercent: o.targetAvailabilityPercent,
  });
}
