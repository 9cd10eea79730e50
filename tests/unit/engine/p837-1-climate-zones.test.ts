import { describe, expect, it } from 'vitest';
import { CLIMATE_ZONES, CLIMATE_ZONE_P_PERCENT_P837_1, CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1, EngineInputError, climateZoneRainRate, type ClimateZone } from '@/server/engine';
import { num, readReferenceCsv } from './reference-csv';

// Source: Rec. ITU-R P.837-1 (1994), rain rate exceeded per climate zone — the reference file
// itu-p837-1-climate-zones.csv was typed from memory, and so was the engine's embedded table;
// this test checks the two agree row by row (it cannot vouch for the Recommendation itself).
const SOURCE = 'Rec. ITU-R P.837-1 (1994) zone table, typed from memory';
const rows = readReferenceCsv('itu-p837-1-climate-zones.csv');
const COLUMNS = ['r_1_percent', 'r_0_3_percent', 'r_0_1_percent', 'r_0_03_percent', 'r_0_01_percent', 'r_0_003_percent', 'r_0_001_percent'];

describe(`ITU-R P.837-1 zone table against ${SOURCE}`, () => {
  it('has the same 15 zones as the reference file, in order', () => {
    expect(rows).toHaveLength(15);
    expect(rows.map((r) => r.zone)).toEqual([...CLIMATE_ZONES]);
  });

  it.each(rows.map((r) => [r.zone, r] as const))('zone %s: every tabulated rain rate equals the reference row', (zone, row) => {
    const table = CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1[zone as ClimateZone];
    expect(table).toEqual(COLUMNS.map((c) => num(row, c)));
    CLIMATE_ZONE_P_PERCENT_P837_1.forEach((p, i) => {
      expect(climateZoneRainRate({ zone: zone as ClimateZone, pPercent: p })).toBe(num(row, COLUMNS[i]));
    });
  });
});

describe('log-log interpolation between tabulated points (server/engine/README.md §1, source 4)', () => {
  it('halfway in log p between 0.01 % and 0.03 % gives the geometric mean of the two rates', () => {
    const p = Math.sqrt(0.01 * 0.03);
    expect(climateZoneRainRate({ zone: 'K', pPercent: p })).toBeCloseTo(Math.sqrt(42 * 23), 10);
  });
  it('rates fall monotonically as p grows in every zone', () => {
    for (const zone of CLIMATE_ZONES) {
      let last = Infinity;
      for (let lp = Math.log10(0.001); lp <= 0; lp += 0.05) {
        const r = climateZoneRainRate({ zone, pPercent: 10 ** lp });
        expect(r).toBeLessThanOrEqual(last + 1e-12);
        last = r;
      }
    }
  });
});

describe('edge cases', () => {
  it('p outside the table (0.001–1 %) is not extrapolated', () => {
    expect(() => climateZoneRainRate({ zone: 'A', pPercent: 2 })).toThrow(EngineInputError);
    expect(() => climateZoneRainRate({ zone: 'A', pPercent: 0.0005 })).toThrowError(/pPercent/);
  });
  it('unknown zone letters (I, O, lower case) are refused naming climateZone', () => {
    for (const z of ['I', 'O', 'k', '']) {
      try {
        climateZoneRainRate({ zone: z as ClimateZone, pPercent: 0.01 });
        expect.unreachable();
      } catch (e) {
        expect((e as EngineInputError).field).toBe('climateZone');
      }
    }
  });
});
