import { describe, expect, it } from 'vitest';
import { EngineInputError } from '@/server/engine/errors';
import { OXYGEN_LINES_P676_12, WATER_VAPOUR_LINES_P676_12 } from '@/server/engine/p676-12-line-data';
import { gasSlantPathAttenuation, gasSlantPathAttenuationUnchecked, type GasSlantPathOptions } from '@/server/engine/p676-12-gas-slant-path';
import { gasSpecificAttenuation } from '@/server/engine/p676-12-specific-attenuation';
import { standardPressureHpaP835 } from '@/server/engine/p835-standard-pressure';
import { expectRelative, num, readReferenceCsv } from './reference-csv';

// Sources, named beside every check:
// - itu-p676-12-oxygen-lines.csv / -water-vapour-lines.csv: Rec. ITU-R P.676-12 Annex 1, Tables 1 and 2.
// - itu-p676-12-specific-attenuation.csv: ITU-R SG 3 validation examples, Rec. ITU-R P.676-12 (γ_o, γ_w,
//   1–350 GHz at 1013.25 hPa, 288.15 K, 7.5 g/m³).
// - itu-p676-12-gas-attenuation.csv: ITU-R SG 3 validation examples, Rec. ITU-R P.676-12 (Annex 2 slant
//   path; ρ and V from P.836-6, T from P.1510-1, P from the P.835 reference atmosphere at the station).
const LINES_SOURCE = 'Rec. ITU-R P.676-12 Annex 1, Tables 1 and 2';
const SOURCE = 'ITU-R SG 3 validation examples, Rec. ITU-R P.676-12';

/**
 * Tolerance for a printed reference figure: 1e-4 relative, or half a unit of the last printed digit
 * where the figure has fewer significant digits than that resolves (one row of the specific-attenuation
 * file prints γ_w at 1 GHz as 5.09E-05, three digits: half a unit is 9.8e-4 relative).
 */
function printedTolerance(cell: string): number {
  const m = /^[-+]?(\d*)\.?(\d*)(?:[eE]([-+]?\d+))?$/.exec(cell.trim());
  if (!m) throw new Error(`not a plain number: ${cell}`);
  const decimals = m[2].length;
  const exponent = m[3] ? Number(m[3]) : 0;
  const halfUnit = 0.5 * 10 ** (exponent - decimals);
  return Math.max(1e-4, halfUnit / Math.abs(Number(cell)));
}

describe(`line tables against ${LINES_SOURCE}`, () => {
  const cases = [
    ['oxygen', 'itu-p676-12-oxygen-lines.csv', OXYGEN_LINES_P676_12, ['f0_ghz', 'a1', 'a2', 'a3', 'a4', 'a5', 'a6']],
    ['water vapour', 'itu-p676-12-water-vapour-lines.csv', WATER_VAPOUR_LINES_P676_12, ['f0_ghz', 'b1', 'b2', 'b3', 'b4', 'b5', 'b6']],
  ] as const;
  it.each(cases)('%s: every row of %s equals the engine table (%s)', (_gas, file, table, columns) => {
    const rows = readReferenceCsv(file);
    expect(rows.length, `row count (${LINES_SOURCE})`).toBe(table.length);
    rows.forEach((row, i) => {
      columns.forEach((c, j) => expect(table[i][j], `${file} row ${i + 1} ${c} (${LINES_SOURCE})`).toBeCloseTo(num(row, c), 9));
    });
  });
});

describe(`specific attenuation (Annex 1) against ${SOURCE}`, () => {
  const rows = readReferenceCsv('itu-p676-12-specific-attenuation.csv');
  // 355 rows: the five spot checks at 12, 20, 60, 90 and 130 GHz, then every GHz from 1 to 350.
  it('reads all 355 rows', () => expect(rows).toHaveLength(355));

  it.each(rows.map((r, i) => [i + 1, num(r, 'frequency_ghz'), r] as const))('row %i (%d GHz): γ_o, γ_w and their sum (%o)', (_i, _f, row) => {
    const g = gasSpecificAttenuation({
      frequencyGHz: num(row, 'frequency_ghz'),
      pressureHpa: num(row, 'pressure_hpa'),
      temperatureK: num(row, 'temperature_k'),
      vapourDensityGM3: num(row, 'vapour_density_g_m3'),
    });
    expectRelative(g.oxygenDbKm, num(row, 'oxygen_db_km'), printedTolerance(row.oxygen_db_km), `γ_o (${SOURCE})`);
    expectRelative(g.waterVapourDbKm, num(row, 'water_vapour_db_km'), printedTolerance(row.water_vapour_db_km), `γ_w (${SOURCE})`);
    expectRelative(g.oxygenDbKm + g.waterVapourDbKm, num(row, 'total_db_km'), printedTolerance(row.total_db_km), `γ_o + γ_w (${SOURCE})`);
  });
});

describe(`slant-path gaseous attenuation (Annex 2) against ${SOURCE}`, () => {
  const rows = readReferenceCsv('itu-p676-12-gas-attenuation.csv');
  const options = (row: Record<string, string>): GasSlantPathOptions => ({
    frequencyGHz: num(row, 'frequency_ghz'),
    elevationDeg: num(row, 'elevation_deg'),
    pressureHpa: num(row, 'pressure_hpa'),
    temperatureK: num(row, 'temperature_k'),
    surfaceVapourDensityGM3: num(row, 'surface_vapour_density_g_m3'),
    waterVapourContentKgM2: num(row, 'water_vapour_content_kg_m2'),
    stationHeightKm: num(row, 'station_height_km'),
  });
  it('reads all 32 rows', () => expect(rows).toHaveLength(32));

  // 1e-5 relative: stricter than the engine's 1e-4 rule; the implementation is within 2.2e-6 on every row.
  it.each(rows.map((r, i) => [i + 1, r] as const))('row %i: total slant-path attenuation to 1e-5 (%o)', (_i, row) => {
    const a = gasSlantPathAttenuation(options(row));
    expectRelative(a.totalDb, num(row, 'gas_attenuation_db'), 1e-5, `A_gas (${SOURCE})`);
    expect(a.oxygenDb + a.waterVapourDb).toBe(a.totalDb);
  });

  it.each(rows.map((r, i) => [i + 1, r] as const))('row %i: P.835 pressure at the station height to 1e-8 (%o)', (_i, row) => {
    expectRelative(standardPressureHpaP835(num(row, 'station_height_km')), num(row, 'pressure_hpa'), 1e-8, `P (${SOURCE})`);
  });

  it('the unchecked twin gives the same figures', () => {
    const o = options(rows[0]);
    expect(
      gasSlantPathAttenuationUnchecked(o.frequencyGHz, o.elevationDeg, o.pressureHpa, o.temperatureK, o.surfaceVapourDensityGM3, o.waterVapourContentKgM2, o.stationHeightKm),
    ).toEqual(gasSlantPathAttenuation(o));
  });
});

describe('edge cases', () => {
  // V6 at 14.25 GHz, first row of the validation file (ITU-R SG 3 validation examples, Rec. ITU-R P.676-12).
  const base: GasSlantPathOptions = {
    frequencyGHz: 14.25,
    elevationDeg: 46.35969261,
    pressureHpa: 1013.25,
    temperatureK: 293.3696795,
    surfaceVapourDensityGM3: 22.73000178,
    waterVapourContentKgM2: 37.95559991,
    stationHeightKm: 0,
  };

  it.each([
    [{ frequencyGHz: 0.5 }, 'frequencyGHz'],
    [{ frequencyGHz: 351 }, 'frequencyGHz'],
    [{ frequencyGHz: Number.NaN }, 'frequencyGHz'],
    [{ elevationDeg: 4.9 }, 'elevationDeg'],
    [{ elevationDeg: 90.1 }, 'elevationDeg'],
    [{ pressureHpa: 250 }, 'pressureHpa'],
    [{ pressureHpa: Number.POSITIVE_INFINITY }, 'pressureHpa'],
    [{ temperatureK: 150 }, 'temperatureK'],
    [{ temperatureK: 400 }, 'temperatureK'],
    [{ surfaceVapourDensityGM3: -1 }, 'surfaceVapourDensityGM3'],
    [{ surfaceVapourDensityGM3: 61 }, 'surfaceVapourDensityGM3'],
    [{ waterVapourContentKgM2: -0.1 }, 'waterVapourContentKgM2'],
    [{ waterVapourContentKgM2: 101 }, 'waterVapourContentKgM2'],
    [{ waterVapourContentKgM2: 1e-9 }, 'waterVapourContentKgM2'],
    [{ stationHeightKm: -0.1 }, 'stationHeightKm'],
    [{ stationHeightKm: 11 }, 'stationHeightKm'],
    [{ stationHeightKm: '0.1' as unknown as number }, 'stationHeightKm'],
  ])('bad input %o throws EngineInputError naming %s', (change, field) => {
    const run = () => gasSlantPathAttenuation({ ...base, ...change });
    expect(run).toThrow(EngineInputError);
    try {
      run();
    } catch (e) {
      expect((e as EngineInputError).field).toBe(field);
    }
  });

  it('P.835 pressure: 1013.25 hPa at sea level; bad heights throw EngineInputError naming stationHeightKm', () => {
    expect(standardPressureHpaP835(0)).toBe(1013.25);
    expect(standardPressureHpaP835(2)).toBeLessThan(standardPressureHpaP835(1));
    for (const h of [-0.01, 11.5, Number.NaN]) {
      expect(() => standardPressureHpaP835(h)).toThrow(EngineInputError);
      try {
        standardPressureHpaP835(h);
      } catch (e) {
        expect((e as EngineInputError).field).toBe('stationHeightKm');
      }
    }
  });

  it('V_t = 0 gives a zero water-vapour term, so the total is the oxygen term', () => {
    for (const frequencyGHz of [1, 14.25, 22.235, 29, 183.31, 350]) {
      const a = gasSlantPathAttenuation({ ...base, frequencyGHz, waterVapourContentKgM2: 0, stationHeightKm: 0.5 });
      expect(a.waterVapourDb).toBe(0);
      expect(a.totalDb).toBe(a.oxygenDb);
      expect(a.oxygenDb).toBeGreaterThan(0);
    }
  });

  it('ρ = 0 (dry surface air) changes only the oxygen term: the water-vapour term comes from V_t', () => {
    const wet = gasSlantPathAttenuation(base);
    const dry = gasSlantPathAttenuation({ ...base, surfaceVapourDensityGM3: 0 });
    expect(dry.waterVapourDb).toBe(wet.waterVapourDb);
    expect(dry.oxygenDb).toBeGreaterThan(0);
    expect(Math.abs(dry.oxygenDb / wet.oxygenDb - 1)).toBeLessThan(0.05); // e only widens lines and raises r_p
  });

  it('every term scales as 1/sin θ', () => {
    const zenith = gasSlantPathAttenuation({ ...base, elevationDeg: 90 });
    const low = gasSlantPathAttenuation({ ...base, elevationDeg: 10 });
    expect(low.totalDb * Math.sin((10 * Math.PI) / 180)).toBeCloseTo(zenith.totalDb, 12);
  });

  it('station height changes the water-vapour term above 20 GHz only', () => {
    const at = (frequencyGHz: number, stationHeightKm: number) => gasSlantPathAttenuation({ ...base, frequencyGHz, stationHeightKm }).waterVapourDb;
    expect(at(14.25, 1)).toBe(at(14.25, 0));
    expect(at(20, 1)).toBe(at(20, 0));
    expect(at(29, 1)).toBeLessThan(at(29, 0));
  });

  it('stays finite and positive across 1–350 GHz, 5–90°, and the accepted climate ranges', () => {
    for (const frequencyGHz of [1, 10, 22.235, 50, 57, 60, 63, 70, 118.75, 183.31, 325.15, 350]) {
      for (const o of [
        { pressureHpa: 300, temperatureK: 200, surfaceVapourDensityGM3: 0, waterVapourContentKgM2: 1e-6, stationHeightKm: 10, elevationDeg: 5 },
        { pressureHpa: 1100, temperatureK: 350, surfaceVapourDensityGM3: 60, waterVapourContentKgM2: 100, stationHeightKm: 0, elevationDeg: 90 },
      ]) {
        const a = gasSlantPathAttenuation({ ...base, ...o, frequencyGHz });
        expect(Number.isFinite(a.totalDb) && a.oxygenDb > 0 && a.waterVapourDb > 0, `${frequencyGHz} GHz ${JSON.stringify(o)}`).toBe(true);
      }
    }
  });
});
