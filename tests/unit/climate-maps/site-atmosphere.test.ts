import { describe, expect, it } from 'vitest';
import { reducedCloudLiquidAt, siteAtmosphere, siteClimate, TABULATED_P_PERCENT, vapourAt } from '@/server/climate-maps';
import { num, readReferenceCsv } from '../engine/reference-csv';
import { expectReference } from './map-reference';

/**
 * Water vapour (P.836-6) and cloud liquid (P.840-8) against every row of the ITU-R Study Group 3
 * validation figures (tests/fixtures/reference/README.md). The rows sit at tabulated p (0.1, 0.2,
 * 0.3, 0.5, 1 %) and between them (0.15, 0.35 %), so both the maps and the ln-p rule are checked.
 */
describe('water vapour and cloud liquid against ITU-R validation figures', () => {
  it.each(readReferenceCsv('itu-p840-8-reduced-cloud-liquid.csv'))(
    'L_red at $site ($lat_deg, $lon_deg), p = $p_percent % (ITU-R SG 3 validation examples, Rec. ITU-R P.840-8)',
    (row) => {
      const lRed = reducedCloudLiquidAt({ latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg'), pPercent: num(row, 'p_percent') });
      expectReference(lRed, num(row, 'reduced_cloud_liquid_kg_m2'), `${row.site} L_red(${row.p_percent})`);
    },
  );

  it.each(readReferenceCsv('itu-p836-6-water-vapour-content.csv'))(
    'V at $site, station at $altitude_km km, p = $p_percent % (ITU-R SG 3 validation examples, Rec. ITU-R P.836-6)',
    (row) => {
      const v = vapourAt({ latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg'), stationHeightKm: num(row, 'altitude_km'), pPercent: num(row, 'p_percent') });
      expectReference(v.waterVapourContentKgM2, num(row, 'water_vapour_content_kg_m2'), `${row.site} V(${row.p_percent})`);
    },
  );

  it.each(readReferenceCsv('itu-p836-6-surface-vapour-density.csv'))(
    'ρ at $site, station at $altitude_km km, p = $p_percent % (ITU-R SG 3 validation examples, Rec. ITU-R P.836-6)',
    (row) => {
      const v = vapourAt({ latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg'), stationHeightKm: num(row, 'altitude_km'), pPercent: num(row, 'p_percent') });
      expectReference(v.surfaceVapourDensityGM3, num(row, 'surface_vapour_density_g_m3'), `${row.site} ρ(${row.p_percent})`);
    },
  );

  it.each(readReferenceCsv('itu-p836-6-water-vapour-content.csv').filter((row) => row.p_percent === '0.1'))(
    'siteAtmosphere at $site gives the 0.1 % level of the validation figures (ITU-R SG 3 validation examples, Rec. ITU-R P.836-6)',
    (row) => {
      const site = { latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg'), stationHeightKm: num(row, 'altitude_km') };
      const a = siteAtmosphere(site);
      expect(a.levels.map((l) => l.pPercent)).toEqual([...TABULATED_P_PERCENT]);
      expectReference(a.levels[0].waterVapourContentKgM2, num(row, 'water_vapour_content_kg_m2'), `${row.site} V(0.1)`);
      const density = readReferenceCsv('itu-p836-6-surface-vapour-density.csv').find((r) => r.site === row.site && r.p_percent === '0.1')!;
      expectReference(a.levels[0].surfaceVapourDensityGM3, num(density, 'surface_vapour_density_g_m3'), `${row.site} ρ(0.1)`);
    },
  );

  it.each(readReferenceCsv('itu-p1510-1-annual-temperature.csv').filter((row) => row.site !== 'V9'))(
    'siteAtmosphere surface temperature and N_wet at $site agree with siteClimate (ITU-R SG 3 validation examples, Rec. ITU-R P.1510-1)',
    (row) => {
      const site = { latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg') };
      const a = siteAtmosphere({ ...site, stationHeightKm: 0 });
      expectReference(a.surfaceTemperatureK, num(row, 'temperature_k'), `${row.site} T`);
      expect(a.nWetMedian).toBe(siteClimate(site).nWetMedian);
    },
  );

  it('every level of siteAtmosphere equals vapourAt and reducedCloudLiquidAt at its tabulated p', () => {
    const site = { latDeg: 41.9, lonDeg: 12.49, stationHeightKm: 0.04612299 };
    const a = siteAtmosphere(site);
    for (const level of a.levels) {
      const v = vapourAt({ ...site, pPercent: level.pPercent });
      expect(level.waterVapourContentKgM2, `V(${level.pPercent})`).toBe(v.waterVapourContentKgM2);
      expect(level.surfaceVapourDensityGM3, `ρ(${level.pPercent})`).toBe(v.surfaceVapourDensityGM3);
      expect(level.reducedCloudLiquidKgM2, `L_red(${level.pPercent})`).toBe(reducedCloudLiquidAt({ ...site, pPercent: level.pPercent }));
    }
    // Exceeded more often means less water: each quantity falls (or stays) as p rises.
    for (let k = 1; k < a.levels.length; k++) {
      expect(a.levels[k].waterVapourContentKgM2).toBeLessThanOrEqual(a.levels[k - 1].waterVapourContentKgM2);
      expect(a.levels[k].reducedCloudLiquidKgM2).toBeLessThanOrEqual(a.levels[k - 1].reducedCloudLiquidKgM2);
    }
  });

  it('a higher station has less vapour above it (P.836-6 scale-height rule)', () => {
    const low = vapourAt({ latDeg: 28.717, lonDeg: 77.3, stationHeightKm: 0.2, pPercent: 1 });
    const high = vapourAt({ latDeg: 28.717, lonDeg: 77.3, stationHeightKm: 2.2, pPercent: 1 });
    expect(high.waterVapourContentKgM2).toBeLessThan(low.waterVapourContentKgM2 * 0.9);
    expect(high.surfaceVapourDensityGM3).toBeLessThan(low.surfaceVapourDensityGM3 * 0.9);
  });
});
