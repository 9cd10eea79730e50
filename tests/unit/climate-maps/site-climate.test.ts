import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAP_DATA_VERSION, mapRecommendations, mapsDir, siteClimate, type SiteClimate } from '@/server/climate-maps';
import { monthlyRainClimate } from '@/server/engine/p837-7-monthly-climate';
import { num, readReferenceCsv } from '../engine/reference-csv';
import { expectReference } from './map-reference';

/**
 * siteClimate against every row of the ITU-R Study Group 3 validation figures for the maps it
 * reads (files and sources in tests/fixtures/reference/README.md). Each figure is read at the
 * row's own coordinates; nothing is typed in here.
 */
const at = (row: Record<string, string>): SiteClimate => siteClimate({ latDeg: num(row, 'lat_deg'), lonDeg: num(row, 'lon_deg') });

describe('siteClimate against ITU-R validation figures', () => {
  it.each(readReferenceCsv('itu-p839-4-rain-height.csv'))('0 °C isotherm and rain height at $site (ITU-R SG 3 validation examples, Rec. ITU-R P.839-4)', (row) => {
    const c = at(row);
    expectReference(c.isothermHeightKm, num(row, 'isotherm_height_km'), `${row.site} h0`);
    expectReference(c.rainHeightKm, num(row, 'rain_height_km'), `${row.site} hR`);
  });

  it.each(readReferenceCsv('itu-p1511-1-topographic-height.csv'))('topographic height at $site (ITU-R SG 3 validation examples, Rec. ITU-R P.1511-1)', (row) => {
    expectReference(at(row).topographicHeightKm, num(row, 'topographic_height_km'), `${row.site} height`);
  });

  it.each(readReferenceCsv('itu-p453-14-nwet.csv'))('median N_wet at $site (ITU-R SG 3 validation examples, Rec. ITU-R P.453-14)', (row) => {
    expect(num(row, 'p_percent'), 'the file gives the median').toBe(50);
    expectReference(at(row).nWetMedian, num(row, 'n_wet'), `${row.site} N_wet`);
  });

  it.each(readReferenceCsv('itu-p1510-1-annual-temperature.csv'))('annual mean surface temperature at $site (ITU-R SG 3 validation examples, Rec. ITU-R P.1510-1)', (row) => {
    expectReference(at(row).annualMeanTemperatureK, num(row, 'temperature_k'), `${row.site} T`);
  });

  it.each(readReferenceCsv('itu-p837-7-rain-rate.csv'))(
    'R_p at p = $p_percent % and P0 at $site (ITU-R SG 3 validation examples, Rec. ITU-R P.837-7)',
    (row) => {
      const c = at(row);
      // R_p at any p goes through the engine's Annex 1 on the map-derived normals, as a study does.
      const rain = monthlyRainClimate({ monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC });
      expectReference(rain.rainRateExceeded(num(row, 'p_percent')), num(row, 'rain_rate_mm_h'), `${row.site} R_${row.p_percent}`);
      expectReference(c.p0Percent, num(row, 'p0_percent'), `${row.site} P0`);
      if (num(row, 'p_percent') === 0.01) expectReference(c.r001MmH, num(row, 'rain_rate_mm_h'), `${row.site} R0.01`);
    },
  );

  describe('monthly normals (Rec. ITU-R P.837-7 MT maps and Rec. ITU-R P.1510-1 monthly T maps, bilinear at the site)', () => {
    it.each(readReferenceCsv('itu-p837-7-monthly-climate.csv'))('$site month $month', (row) => {
      const c = at(row);
      const m = num(row, 'month') - 1;
      expectReference(c.monthlyRainfallMm[m], num(row, 'mean_total_rainfall_mm'), `${row.site} MT ${row.month}`);
      expectReference(c.monthlyTemperatureC[m], num(row, 'mean_surface_temperature_c'), `${row.site} T ${row.month}`);
    });
  });

  it('names the Recommendation of each figure and the map data it read', () => {
    const c = siteClimate({ latDeg: 51.5, lonDeg: -0.14 });
    expect(c.sources).toEqual({
      isothermHeightKm: 'ITU-R P.839-4',
      rainHeightKm: 'ITU-R P.839-4',
      topographicHeightKm: 'ITU-R P.1511-1',
      nWetMedian: 'ITU-R P.453-14',
      annualMeanTemperatureK: 'ITU-R P.1510-1',
      monthlyRainfallMm: 'ITU-R P.837-7',
      monthlyTemperatureC: 'ITU-R P.1510-1',
      r001MmH: 'ITU-R P.837-7 Annex 1',
      p0Percent: 'ITU-R P.837-7 Annex 1',
    });
    // The version is the maps.json the project ships, so a changed catalogue changes what studies record.
    const catalogueHash = createHash('sha256').update(fs.readFileSync(path.join(mapsDir(), 'maps.json'))).digest('hex').slice(0, 12);
    expect(MAP_DATA_VERSION).toBe(catalogueHash);
    expect(c.mapVersions).toEqual(['ITU-R P.839-4', 'ITU-R P.1511-1', 'ITU-R P.453-14', 'ITU-R P.1510-1', 'ITU-R P.837-7', `maps:${catalogueHash}`]);
    expect([...mapRecommendations].sort()).toEqual(['ITU-R P.1510-1', 'ITU-R P.1511-1', 'ITU-R P.453-14', 'ITU-R P.836-6', 'ITU-R P.837-7', 'ITU-R P.839-4', 'ITU-R P.840-8']);
  });
});

