import { describe, expect, it } from 'vitest';
import { EngineInputError, monthlyRainClimate } from '@/server/engine';
import { expectRelative, num, readReferenceCsv } from './reference-csv';

// Sources: inputs — Rec. ITU-R P.837-7 monthly mean total rainfall maps and Rec. ITU-R P.1510-1
// monthly mean surface temperature maps, bilinearly interpolated at each site
// (itu-p837-7-monthly-climate.csv); expected R_p and P0 — ITU-R SG 3 validation examples for
// Rec. ITU-R P.837-7 (itu-p837-7-rain-rate.csv).
const SOURCE = 'ITU-R SG 3 validation examples, Rec. ITU-R P.837-7 (inputs: P.837-7 / P.1510-1 monthly maps)';
const monthly = readReferenceCsv('itu-p837-7-monthly-climate.csv');
const expected = readReferenceCsv('itu-p837-7-rain-rate.csv');

function normalsOf(site: string) {
  const rain: number[] = new Array(12);
  const temp: number[] = new Array(12);
  for (const r of monthly.filter((m) => m.site === site)) {
    rain[num(r, 'month') - 1] = num(r, 'mean_total_rainfall_mm');
    temp[num(r, 'month') - 1] = num(r, 'mean_surface_temperature_c');
  }
  return { monthlyRainfallMm: rain, monthlyTemperatureC: temp };
}

const V8 = normalsOf('V8');

describe(`monthlyRainClimate (ITU-R P.837-7 Annex 1) against ${SOURCE}`, () => {
  it('reads 60 monthly rows (5 sites × 12 months) and 25 expected rows', () => {
    expect(monthly).toHaveLength(60);
    expect(expected).toHaveLength(25);
    for (const site of new Set(monthly.map((m) => m.site))) {
      const n = normalsOf(site);
      expect(n.monthlyRainfallMm.every(Number.isFinite) && n.monthlyTemperatureC.every(Number.isFinite)).toBe(true);
    }
  });

  it.each(expected.map((r) => [r.site, r.p_percent, r] as const))('site %s, p = %s %%: R_p and P0 match to 1e-4', (site, _p, row) => {
    const climate = monthlyRainClimate(normalsOf(site));
    expectRelative(climate.p0Percent, num(row, 'p0_percent'), 1e-4, `P0 ${site} (${SOURCE})`);
    expectRelative(climate.rainRateExceeded(num(row, 'p_percent')), num(row, 'rain_rate_mm_h'), 1e-4, `R_p ${site} (${SOURCE})`);
  });
});

describe('Annex 1 behaviour', () => {
  const climate = monthlyRainClimate(V8);
  it('rainRateExceeded and probabilityExceeded are inverses (step 6)', () => {
    for (const p of [0.001, 0.01, 0.1, 1, 3]) {
      expect(climate.probabilityExceeded(climate.rainRateExceeded(p))).toBeCloseTo(p, 10);
    }
  });
  it('P(R > 0) is P0 and P falls as R rises', () => {
    expect(climate.probabilityExceeded(0)).toBe(climate.p0Percent);
    expect(climate.probabilityExceeded(10)).toBeLessThan(climate.probabilityExceeded(5));
  });
  it('p at or above P0 gives R_p = 0 (the site is dry that share of the time)', () => {
    expect(climate.rainRateExceeded(climate.p0Percent)).toBe(0);
    expect(climate.rainRateExceeded(50)).toBe(0);
  });
  it('step 3 cap: a month wet enough for P0_ii > 70 % is held at 70 %', () => {
    const wet = monthlyRainClimate({ monthlyRainfallMm: new Array(12).fill(2000), monthlyTemperatureC: new Array(12).fill(-5) });
    expect(wet.p0Percent).toBeCloseTo(70, 10);
  });
});

describe('edge cases', () => {
  it('a desert with no rain at all has P0 = 0 and R_p = 0, never NaN', () => {
    const dry = monthlyRainClimate({ monthlyRainfallMm: new Array(12).fill(0), monthlyTemperatureC: new Array(12).fill(30) });
    expect(dry.p0Percent).toBe(0);
    expect(dry.rainRateExceeded(0.01)).toBe(0);
    expect(dry.probabilityExceeded(1)).toBe(0);
  });

  it.each([
    [{ ...V8, monthlyRainfallMm: V8.monthlyRainfallMm.slice(0, 11) }, 'monthlyRainfallMm'],
    [{ ...V8, monthlyRainfallMm: V8.monthlyRainfallMm.map((v, i) => (i === 3 ? -1 : v)) }, 'monthlyRainfallMm[3]'],
    [{ ...V8, monthlyTemperatureC: V8.monthlyTemperatureC.map((v, i) => (i === 7 ? Number.NaN : v)) }, 'monthlyTemperatureC[7]'],
    [{ ...V8, monthlyTemperatureC: V8.monthlyTemperatureC.map((v, i) => (i === 0 ? 99 : v)) }, 'monthlyTemperatureC[0]'],
  ])('bad normals throw EngineInputError naming the field (%#)', (o, field) => {
    try {
      monthlyRainClimate(o);
      expect.unreachable('should have thrown');
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });

  it('p outside 0.0001–100 % and negative rain rates are refused', () => {
    const climate = monthlyRainClimate(V8);
    expect(() => climate.rainRateExceeded(0)).toThrowError(/pPercent/);
    expect(() => climate.rainRateExceeded(Number.NaN)).toThrowError(/pPercent/);
    expect(() => climate.probabilityExceeded(-2)).toThrowError(/rainRateMmH/);
  });
});
