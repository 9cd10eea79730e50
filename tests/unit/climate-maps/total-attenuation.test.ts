import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siteAtmosphere, siteClimate, totalAttenuation } from '@/server/climate-maps';
import { EngineInputError, prepareRainPath } from '@/server/engine';
import { cloudAttenuation } from '@/server/engine/p840-8-cloud-attenuation';
import { scintillationSigmaUnchecked } from '@/server/engine/p618-scintillation';
import { prepareAtmosphericPath, totalAttenuationCurve } from '@/server/engine/p618-total-attenuation';
import { reducedCloudLiquidAt } from '@/server/climate-maps';
import { num, readReferenceCsv } from '../engine/reference-csv';
import { expectReference } from './map-reference';

// Sources named beside each check: ITU-R SG 3 validation examples for Rec. ITU-R P.618-13 §2.5
// (itu-p618-13-total-attenuation.csv: every component and the total from coordinates, altitude,
// frequency, elevation, dish and p) and for Rec. ITU-R P.840-8 (itu-p840-8-cloud-attenuation.csv).
const TOTAL = 'ITU-R SG 3 validation examples, Rec. ITU-R P.618-13 §2.5';
const CLOUD = 'ITU-R SG 3 validation examples, Rec. ITU-R P.840-8';
const totals = readReferenceCsv('itu-p618-13-total-attenuation.csv');
const clouds = readReferenceCsv('itu-p840-8-cloud-attenuation.csv');

function optionsOf(r: Record<string, string>) {
  return {
    latDeg: num(r, 'lat_deg'),
    lonDeg: num(r, 'lon_deg'),
    stationHeightKm: num(r, 'station_height_km'),
    frequencyGHz: num(r, 'frequency_ghz'),
    elevationDeg: num(r, 'elevation_deg'),
    tiltDeg: num(r, 'tilt_deg'),
    diameterM: num(r, 'diameter_m'),
    efficiency: num(r, 'efficiency'),
    pPercent: num(r, 'p_percent'),
  };
}

describe(`totalAttenuation from coordinates against ${TOTAL}`, () => {
  it('reads all 32 rows', () => expect(totals).toHaveLength(32));

  it.each(totals.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))('%s, %s GHz, p = %s %%: gas, cloud, rain, scintillation and total to 1e-4', (site, _f, _p, r) => {
    const a = totalAttenuation(optionsOf(r));
    const at = `${site} ${r.frequency_ghz} GHz p=${r.p_percent} (${TOTAL})`;
    expectReference(a.gasDb, num(r, 'gas_db'), `gas ${at}`);
    expectReference(a.cloudDb, num(r, 'cloud_db'), `cloud ${at}`);
    expectReference(a.rainDb, num(r, 'rain_db'), `rain ${at}`);
    expectReference(a.scintillationDb, num(r, 'scintillation_db'), `scintillation ${at}`);
    expectReference(a.totalDb, num(r, 'total_db'), `total ${at}`);
  });

  it.each(totals.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))('%s, %s GHz, p = %s %%: gases and clouds at 1 %% (the values the total holds below 1 %%)', (_s, _f, _p, r) => {
    const o = optionsOf(r);
    const a1 = totalAttenuation({ ...o, pPercent: 1 });
    expectReference(a1.gasDb, num(r, 'gas_1pct_db'), `gas at 1 % (${TOTAL})`);
    expectReference(a1.cloudDb, num(r, 'cloud_1pct_db'), `cloud at 1 % (${TOTAL})`);
  });
});

describe(`cloud attenuation (P.840-8 L_red from the maps × K_l at 0 °C / sin θ) against ${CLOUD}`, () => {
  it.each(clouds.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))('%s, %s GHz, p = %s %%', (site, _f, _p, r) => {
    const l = reducedCloudLiquidAt({ latDeg: num(r, 'lat_deg'), lonDeg: num(r, 'lon_deg'), pPercent: num(r, 'p_percent') });
    const a = cloudAttenuation({ frequencyGHz: num(r, 'frequency_ghz'), elevationDeg: num(r, 'elevation_deg'), reducedCloudLiquidKgM2: l });
    expectReference(a, num(r, 'cloud_attenuation_db'), `${site} (${CLOUD})`);
  });
});

describe('laws of the total (server/engine/README.md §5, now on the P.618-14 §2.5 total)', () => {
  // Sites between 60° S and 60° N over land and sea, Ku and Ka, realistic paths.
  const siteArb = fc.record({
    latDeg: fc.double({ min: -55, max: 60, noNaN: true }),
    lonDeg: fc.double({ min: -180, max: 180, noNaN: true }),
    frequencyGHz: fc.constantFrom(11.7, 14.25, 19.7, 29.5),
    elevationDeg: fc.double({ min: 6, max: 85, noNaN: true }),
    tiltDeg: fc.constantFrom(0, 45, 90),
  });
  const curveOf = (s: { latDeg: number; lonDeg: number; frequencyGHz: number; elevationDeg: number; tiltDeg: number }, diameterM: number) => {
    const c = siteClimate(s);
    const h = Math.max(0, c.topographicHeightKm);
    const atmosphere = siteAtmosphere({ ...s, stationHeightKm: h });
    const rainPath = prepareRainPath({ latDeg: s.latDeg, stationHeightKm: h, frequencyGHz: s.frequencyGHz, elevationDeg: s.elevationDeg, tiltDeg: s.tiltDeg, r001MmH: c.r001MmH, rainHeightKm: c.rainHeightKm });
    const atmosphericPath = prepareAtmosphericPath({ frequencyGHz: s.frequencyGHz, elevationDeg: s.elevationDeg, stationHeightKm: h, atmosphere });
    return totalAttenuationCurve({ rainPath, atmosphericPath, scintillationSigmaDb: scintillationSigmaUnchecked(s.frequencyGHz, s.elevationDeg, diameterM, 0.65, atmosphere.nWetMedian) });
  };
  const pArb = fc.double({ min: Math.log(0.001), max: Math.log(5), noNaN: true }).map(Math.exp);

  it('exceedance(total(p)) is the largest p with that total: ≥ p and the same total to 1e-9', () => {
    fc.assert(
      fc.property(siteArb, pArb, (s, p) => {
        const curve = curveOf(s, 0.9);
        const a = curve.totalAt(p);
        const ex = curve.exceedanceOf(a);
        expect(ex.bound).toBe('none');
        expect(ex.pPercent).toBeGreaterThanOrEqual(p * (1 - 1e-9));
        expect(Math.abs(curve.totalAt(ex.pPercent) / a - 1)).toBeLessThan(1e-9);
      }),
      { numRuns: 60, seed: 20261202 },
    );
  });

  it('a bigger dish never has more outage at the same fade threshold (scintillation averages out over a larger aperture)', () => {
    fc.assert(
      fc.property(siteArb, fc.double({ min: 0.5, max: 25, noNaN: true }), (s, threshold) => {
        const small = curveOf(s, 0.6).exceedanceOf(threshold);
        const big = curveOf(s, 1.8).exceedanceOf(threshold);
        expect(big.pPercent).toBeLessThanOrEqual(small.pPercent * (1 + 1e-9));
      }),
      { numRuns: 60, seed: 20261203 },
    );
  });
});

describe('edge cases', () => {
  const v8 = optionsOf(totals[0]);
  it('no map data (88.9° N, 100° E) is refused with a clear message, never a number', () => {
    expect(() => totalAttenuation({ ...v8, latDeg: 88.9, lonDeg: 100 })).toThrow(/no ITU-R map data/);
  });
  it.each([
    [{ elevationDeg: 3 }, 'elevationDeg'],
    [{ pPercent: 10 }, 'pPercent'],
    [{ frequencyGHz: 80 }, 'frequencyGHz'],
    [{ tiltDeg: 1e308 }, 'tiltDeg'],
    [{ diameterM: 1e308 }, 'diameterM'],
  ])('%o → EngineInputError naming %s', (patch, field) => {
    try {
      totalAttenuation({ ...v8, ...patch });
      throw new Error('expected a refusal');
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });
  it('the total is at least each of its parts at every p', () => {
    for (const p of [0.001, 0.01, 0.1, 1, 3]) {
      const a = totalAttenuation({ ...v8, pPercent: p });
      expect(a.totalDb).toBeGreaterThanOrEqual(a.rainDb);
      expect(a.totalDb).toBeGreaterThan(0);
    }
  });
});
