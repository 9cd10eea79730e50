import { describe, expect, it } from 'vitest';
import { EngineInputError, prepareRainPath, rainAttenuation, rainExceedance } from '@/server/engine';
import { expectRelative, num, readReferenceCsv } from './reference-csv';

// Source: ITU-R Study Group 3 validation examples for Rec. ITU-R P.618-13/-14, rain attenuation
// (file itu-p618-rain-attenuation.csv; rain height = the P.839-4 value at the site, R0.01 given).
const SOURCE = 'ITU-R SG 3 validation examples, Rec. ITU-R P.618-13/-14 rain attenuation';
const rows = readReferenceCsv('itu-p618-rain-attenuation.csv');

function pathOf(row: Record<string, string>) {
  return {
    latDeg: num(row, 'lat_deg'),
    stationHeightKm: num(row, 'station_height_km'),
    frequencyGHz: num(row, 'frequency_ghz'),
    elevationDeg: num(row, 'elevation_deg'),
    tiltDeg: num(row, 'tilt_deg'),
    r001MmH: num(row, 'r001_mm_h'),
    rainHeightKm: num(row, 'rain_height_km'),
  };
}

const V8 = { latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25, elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333 };
const V2_29 = { latDeg: 22.9, stationHeightKm: 0, frequencyGHz: 29, elevationDeg: 22.27833468, tiltDeg: 0, r001MmH: 50.639304, rainHeightKm: 4.15877867 };

describe(`rainAttenuation against ${SOURCE}`, () => {
  it('reads all 32 reference rows', () => {
    expect(rows).toHaveLength(32);
  });

  it.each(rows.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))(
    'site %s, %s GHz, p = %s %%: A_p matches to 1e-4',
    (_s, _f, _p, row) => {
      const a = rainAttenuation({ ...pathOf(row), pPercent: num(row, 'p_percent') });
      expectRelative(a, num(row, 'attenuation_db'), 1e-4, `A_p (${SOURCE})`);
    },
  );

  it.each(rows.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))(
    'site %s, %s GHz, p = %s %%: the inverse of the published A_p gives p back to 1e-4',
    (_s, _f, _p, row) => {
      const ex = rainExceedance({ ...pathOf(row), attenuationDb: num(row, 'attenuation_db') });
      expect(ex.bound).toBe('none');
      expectRelative(ex.pPercent, num(row, 'p_percent'), 1e-4, `p from inverse (${SOURCE})`);
    },
  );
});

describe('rainExceedance round trip over the whole model range (ITU-R P.618-14 step 10 inverse)', () => {
  const ps: number[] = [];
  for (let lp = Math.log(0.001); lp <= Math.log(5) + 1e-12; lp += (Math.log(5) - Math.log(0.001)) / 60) ps.push(Math.exp(lp));
  ps.push(0.001, 1, 5);
  const paths = rows.filter((r) => r.p_percent === '1').map(pathOf);

  it('covers 8 path geometries (every reference site and frequency) × 64 percentages', () => {
    expect(paths.length).toBe(8);
    expect(ps.length).toBe(64);
  });

  it.each(paths.map((p) => [p.latDeg, p.frequencyGHz, p] as const))('lat %s°, %s GHz: exceedance(A(p)) = p to 1e-9 relative', (_l, _f, path) => {
    for (const p of ps) {
      const a = rainAttenuation({ ...path, pPercent: p });
      const ex = rainExceedance({ ...path, attenuationDb: a });
      expect(ex.bound).toBe('none');
      expect(Math.abs(ex.pPercent / Math.min(5, Math.max(0.001, p)) - 1)).toBeLessThan(1e-9);
    }
  });

  it('the low-latitude β branch (|φ| < 36°, θ < 25°, p < 1 %) round-trips too', () => {
    for (const p of [0.0011, 0.004, 0.03, 0.2, 0.7, 0.99, 1.01, 3]) {
      const a = rainAttenuation({ ...V2_29, pPercent: p });
      expect(rainExceedance({ ...V2_29, attenuationDb: a }).pPercent).toBeCloseTo(p, 9);
    }
  });
});

describe('ITU-R P.618-14 §2.2.1.1 steps, worked by hand for site V8 at 14.25 GHz', () => {
  const path = prepareRainPath(V8);
  it('step 2: L_s = (h_R − h_s)/sin θ for θ ≥ 5°', () => {
    expect(path.slantPathKm).toBeCloseTo((V8.rainHeightKm - V8.stationHeightKm) / Math.sin((V8.elevationDeg * Math.PI) / 180), 12);
  });
  it('step 3: L_G = L_s cos θ', () => {
    expect(path.horizontalProjectionKm).toBeCloseTo(path.slantPathKm * Math.cos((V8.elevationDeg * Math.PI) / 180), 12);
  });
  it('step 9: A_0.01 = γ_R L_E and equals the published 0.01 % figure (SG 3 validation example)', () => {
    expect(path.a001Db).toBeCloseTo(path.specificAttenuationDbKm * path.effectivePathKm, 12);
    expectRelative(path.a001Db, 6.798072267, 1e-4, `A_0.01 V8 14.25 GHz (${SOURCE})`);
  });
});

describe('edge cases', () => {
  it('below 0.001 % and above 5 % the inverse reports a bound, never a made-up number', () => {
    const a0001 = rainAttenuation({ ...V8, pPercent: 0.001 });
    const a5 = rainAttenuation({ ...V8, pPercent: 5 });
    expect(rainExceedance({ ...V8, attenuationDb: a0001 * 1.5 })).toEqual({ pPercent: 0.001, bound: 'below-model-range' });
    expect(rainExceedance({ ...V8, attenuationDb: a5 * 0.5 })).toEqual({ pPercent: 5, bound: 'above-model-range' });
    expect(rainExceedance({ ...V8, attenuationDb: 0 })).toEqual({ pPercent: 5, bound: 'above-model-range' });
  });

  it('a station above the rain height has no rain fade (step 2): A_p = 0 and every threshold is below the range', () => {
    const high = { ...V8, stationHeightKm: 3 };
    expect(rainAttenuation({ ...high, pPercent: 0.01 })).toBe(0);
    expect(rainExceedance({ ...high, attenuationDb: 0.1 })).toEqual({ pPercent: 0.001, bound: 'below-model-range' });
  });

  it('R0.01 = 0 gives A_p = 0 (step 4)', () => {
    expect(rainAttenuation({ ...V8, r001MmH: 0, pPercent: 0.1 })).toBe(0);
  });

  it('low elevations (θ < 5°) use the curved-Earth slant path of step 2 and stay finite and positive', () => {
    const low = { ...V8, elevationDeg: 2 };
    const path = prepareRainPath(low);
    const dh = low.rainHeightKm - low.stationHeightKm;
    const s = Math.sin((2 * Math.PI) / 180);
    expect(path.slantPathKm).toBeCloseTo((2 * dh) / (Math.sqrt(s * s + (2 * dh) / 8500) + s), 10);
    expect(rainAttenuation({ ...low, pPercent: 0.01 })).toBeGreaterThan(rainAttenuation({ ...V8, pPercent: 0.01 }));
  });

  it.each([
    [{ pPercent: 0.0009 }, 'pPercent'],
    [{ pPercent: 5.01 }, 'pPercent'],
    [{ pPercent: Number.NaN }, 'pPercent'],
    [{ frequencyGHz: 0.9 }, 'frequencyGHz'],
    [{ frequencyGHz: 56 }, 'frequencyGHz'],
    [{ elevationDeg: 0 }, 'elevationDeg'],
    [{ elevationDeg: -3 }, 'elevationDeg'],
    [{ latDeg: 91 }, 'latDeg'],
    [{ r001MmH: -1 }, 'r001MmH'],
    [{ rainHeightKm: Number.NaN }, 'rainHeightKm'],
    [{ stationHeightKm: Number.POSITIVE_INFINITY }, 'stationHeightKm'],
  ])('rainAttenuation with %o throws EngineInputError naming %s', (patch, field) => {
    const call = () => rainAttenuation({ ...V8, pPercent: 0.01, ...patch });
    expect(call).toThrow(EngineInputError);
    try {
      call();
    } catch (e) {
      expect((e as EngineInputError).field).toBe(field);
    }
  });

  it('a satellite below the horizon is named as such', () => {
    expect(() => rainAttenuation({ ...V8, elevationDeg: -1, pPercent: 0.01 })).toThrowError(/below the horizon/);
  });

  it('rainExceedance refuses a negative or NaN attenuation, naming attenuationDb', () => {
    for (const a of [-0.1, Number.NaN]) {
      expect(() => rainExceedance({ ...V8, attenuationDb: a })).toThrowError(/attenuationDb/);
    }
  });
});
