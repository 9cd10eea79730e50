import { createHash } from 'node:crypto';
import { computeCampaign } from '@/server/campaigns/campaign-compute';
import { computeStudy } from '@/server/studies/compute-study';
import { mapsAltitudeM, readSiteMaps } from '@/server/studies/maps-climate';
import { scenarioFromMaps } from '@/server/studies/tradeoff-scenario-from-maps';
import type { ClimateSnapshot } from '@/server/studies/snapshot';
import type { TradeoffScenarioInput } from '@/server/validation/tradeoff-scenario';
import { climate as knownR001, SEVEN, service } from '../campaigns/campaign-fixture';

/**
 * The three readers of "the ITU-R maps at a site" (a study, a campaign row, the trade-off API) run
 * over a spread of coordinates, for site-maps-callers.test.ts: their outputs before the readers
 * shared one function are kept in fixtures/site-maps-callers.json (written by
 * capture-site-maps-callers.ts) and must not change.
 *
 * Coordinates are a spread of climates and heights (sea, Dead Sea shore below sea level, high
 * plateaus, tropics, desert, both poles, both sides of the antimeridian and of Greenwich); the
 * names say why each is there, no site is a real customer's.
 */
export const SPREAD: { why: string; latDeg: number; lonDeg: number }[] = [
  { why: 'mid-latitude farmland', latDeg: 47.25, lonDeg: 2.5 },
  { why: 'tropics, heavy rain', latDeg: 6.2, lonDeg: -1.6 },
  { why: 'equatorial, heaviest rain', latDeg: 1.3, lonDeg: 103.8 },
  { why: 'southern hemisphere coast', latDeg: -33.9, lonDeg: 151.2 },
  { why: 'high latitude, low elevation', latDeg: 64.1, lonDeg: -21.9 },
  { why: 'high plateau (P.1511-1 near 4 km)', latDeg: -16.5, lonDeg: -68.15 },
  { why: 'high plateau, satellite below the horizon', latDeg: 27.7, lonDeg: 85.3 },
  { why: 'below sea level', latDeg: 31.5, lonDeg: 35.5 },
  { why: 'open sea', latDeg: 0, lonDeg: -30 },
  { why: 'desert, almost no rain', latDeg: 23, lonDeg: 12 },
  { why: 'mountains', latDeg: 40, lonDeg: -105.3 },
  { why: 'longitude given as 359.9', latDeg: 51.5, lonDeg: 359.9 },
  { why: 'antimeridian', latDeg: -17.8, lonDeg: -180 },
  { why: 'antarctic', latDeg: -70, lonDeg: 170 },
  { why: 'no atmosphere map data (88.875° N is blank)', latDeg: 88.9, lonDeg: 100 },
];

/** A study computed on a fixed day, so the stored JSON is the same on every run. */
const NOW = new Date('2026-01-15T12:00:00Z');
/** An override profile without its own 0 °C isotherm: takes the P.839-4 map value. */
const NO_ISOTHERM: ClimateSnapshot = { id: 2, name: 'Zone K', kind: 'climate-zone', data: { zone: 'K' }, zeroIsothermKm: null, sourceNote: 'invented' };

/** Stored JSON drops undefined and writes -0 as 0; compare what would be stored. */
const json = (v: unknown) => JSON.parse(JSON.stringify(v)) as unknown;

/** A whole computed study is ~60 KB of JSON: kept as the sha256 of that JSON (its map inputs are kept whole above it). */
const digest = (v: unknown) => createHash('sha256').update(JSON.stringify(v)).digest('hex');

function outcome(run: () => unknown, keep: (v: unknown) => unknown = json): unknown {
  try {
    return { ok: keep(run()) };
  } catch (e) {
    const err = e as { name?: string; field?: string; message?: string };
    return { error: { name: err.name, field: err.field ?? null, message: err.message } };
  }
}

// Invented satellite and carrier (demo data), as the API takes them.
const API_REST = {
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.8, tiltDeg: 10, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  dishes: [{ diameterM: 0.6, efficiency: 0.65 }],
  targetAvailabilityPercent: 99.9,
};

/** The API's choices of what to leave to the maps. */
const API_VARIANTS: Record<string, (latDeg: number, lonDeg: number) => TradeoffScenarioInput> = {
  coordinatesOnly: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg } }) as TradeoffScenarioInput,
  altitudeGiven: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg, altitudeKm: 0.3505 } }) as TradeoffScenarioInput,
  rainWithoutHeight: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg }, rain: { r001MmH: 40 } }) as TradeoffScenarioInput,
  allGivenRainOnly: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg, altitudeKm: 0.2 }, rain: { climateZone: 'K', rainHeightKm: 3 }, atmosphere: null }) as TradeoffScenarioInput,
  allGivenWithAtmosphere: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg, altitudeKm: 0.2 }, rain: { climateZone: 'K', zeroIsothermHeightKm: 2.9 } }) as TradeoffScenarioInput,
  rainOnlyFromMaps: (latDeg, lonDeg) => ({ ...API_REST, site: { latDeg, lonDeg }, atmosphere: null }) as TradeoffScenarioInput,
};

/** Every caller's output at one site, errors included. */
export function callersAt(latDeg: number, lonDeg: number): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const altitude = outcome(() => mapsAltitudeM(latDeg, lonDeg));
  out.mapsAltitudeM = altitude;
  const mapAltitudeM = (altitude as { ok?: number }).ok ?? 0;
  // A study: the site's altitude is the P.1511-1 default or the one typed in.
  for (const [name, altitudeM] of [['p1511', mapAltitudeM], ['given', 1234]] as const) {
    out[`study.readSiteMaps.${name}`] = outcome(() => readSiteMaps(latDeg, lonDeg, altitudeM / 1000));
    const site = { id: 1, name: 'Site', customerId: 1, customerName: 'Customer', latDeg, lonDeg, altitudeM };
    for (const [c, override] of [['maps', null], ['profile', knownR001], ['profileWithoutIsotherm', NO_ISOTHERM]] as const) {
      out[`study.computeStudy.${name}.${c}`] = outcome(() => computeStudy({ site, service, climate: override, dishes: SEVEN, targetAvailabilityPercent: 99.9, now: NOW }), digest);
    }
  }
  // A campaign row: altitude from the file, or left blank (P.1511-1).
  const rows = [
    { line: 2, siteRef: 'FILE', latDeg, lonDeg, altitudeM: 1234, currentDishCm: 60 },
    { line: 3, siteRef: 'BLANK', latDeg, lonDeg, altitudeM: null, currentDishCm: 60 },
    { line: 4, siteRef: 'ODD', latDeg, lonDeg, altitudeM: 37.5, currentDishCm: 55 },
  ];
  for (const [c, override] of [['maps', null], ['profile', knownR001], ['profileWithoutIsotherm', NO_ISOTHERM]] as const) {
    out[`campaign.${c}`] = outcome(() => computeCampaign({ rows, service, climate: override, dishes: SEVEN, targetAvailabilityPercent: 99.9 }));
  }
  for (const [name, input] of Object.entries(API_VARIANTS)) out[`api.${name}`] = outcome(() => scenarioFromMaps(input(latDeg, lonDeg)));
  return out;
}

export function allCallers(): Record<string, Record<string, unknown>> {
  return Object.fromEntries(SPREAD.map((s) => [`${s.latDeg},${s.lonDeg}`, callersAt(s.latDeg, s.lonDeg)]));
}
