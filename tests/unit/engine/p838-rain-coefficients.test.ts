import { describe, expect, it } from 'vitest';
import { EngineInputError, rainCoefficients, rainSpecificAttenuation } from '@/server/engine';
import { expectRelative, num, readReferenceCsv } from './reference-csv';

// Source: ITU-R Study Group 3 validation examples for Rec. ITU-R P.838-3 (k, α, γ_R),
// file itu-p838-3-specific-attenuation.csv; tolerance 1e-4 relative (server/engine/README.md §6).
const SOURCE = 'ITU-R SG 3 validation examples, Rec. ITU-R P.838-3';
const rows = readReferenceCsv('itu-p838-3-specific-attenuation.csv');

describe(`rainCoefficients and rainSpecificAttenuation against ${SOURCE}`, () => {
  it('reads all 16 reference rows', () => {
    expect(rows).toHaveLength(16);
  });

  it.each(rows.map((r, i) => [i + 1, r] as const))('row %i: k, α and γ_R match to 1e-4 (%o)', (_i, row) => {
    const o = { frequencyGHz: num(row, 'frequency_ghz'), elevationDeg: num(row, 'elevation_deg'), tiltDeg: num(row, 'tilt_deg') };
    const { k, alpha } = rainCoefficients(o);
    expectRelative(k, num(row, 'k'), 1e-4, `k (${SOURCE})`);
    expectRelative(alpha, num(row, 'alpha'), 1e-4, `alpha (${SOURCE})`);
    const gamma = rainSpecificAttenuation({ ...o, rainRateMmH: num(row, 'rain_rate_mm_h') });
    expectRelative(gamma, num(row, 'specific_attenuation_db_km'), 1e-4, `gamma_R (${SOURCE})`);
  });
});

describe('rainCoefficients behaviour (ITU-R P.838-3 eqs. 4–5)', () => {
  it('circular polarization (τ = 45°) gives the mean of k_H and k_V at any elevation', () => {
    const h = rainCoefficients({ frequencyGHz: 20, elevationDeg: 0, tiltDeg: 0 });
    const v = rainCoefficients({ frequencyGHz: 20, elevationDeg: 0, tiltDeg: 90 });
    const c = rainCoefficients({ frequencyGHz: 20, elevationDeg: 37, tiltDeg: 45 });
    expect(c.k).toBeCloseTo((h.k + v.k) / 2, 12);
    expect(c.alpha).toBeCloseTo((h.k * h.alpha + v.k * v.alpha) / (h.k + v.k), 12);
  });

  it('at 90° elevation the tilt no longer matters', () => {
    const a = rainCoefficients({ frequencyGHz: 30, elevationDeg: 90, tiltDeg: 0 });
    const b = rainCoefficients({ frequencyGHz: 30, elevationDeg: 90, tiltDeg: 90 });
    expect(a.k).toBeCloseTo(b.k, 12);
  });
});

describe('edge cases', () => {
  it('zero rain rate gives exactly 0 dB/km', () => {
    expect(rainSpecificAttenuation({ frequencyGHz: 12, elevationDeg: 30, tiltDeg: 0, rainRateMmH: 0 })).toBe(0);
  });

  it.each([
    [{ frequencyGHz: 0.5, elevationDeg: 30, tiltDeg: 0 }, 'frequencyGHz'],
    [{ frequencyGHz: 1500, elevationDeg: 30, tiltDeg: 0 }, 'frequencyGHz'],
    [{ frequencyGHz: Number.NaN, elevationDeg: 30, tiltDeg: 0 }, 'frequencyGHz'],
    [{ frequencyGHz: 12, elevationDeg: 95, tiltDeg: 0 }, 'elevationDeg'],
    [{ frequencyGHz: 12, elevationDeg: 30, tiltDeg: Number.POSITIVE_INFINITY }, 'tiltDeg'],
  ])('bad input %o throws EngineInputError naming %s', (o, field) => {
    expect(() => rainCoefficients(o)).toThrow(EngineInputError);
    try {
      rainCoefficients(o);
    } catch (e) {
      expect((e as EngineInputError).field).toBe(field);
    }
  });

  it('a negative or NaN rain rate is refused, naming rainRateMmH', () => {
    for (const r of [-1, Number.NaN]) {
      expect(() => rainSpecificAttenuation({ frequencyGHz: 12, elevationDeg: 30, tiltDeg: 0, rainRateMmH: r })).toThrowError(/rainRateMmH/);
    }
  });

  it('the frequency range ends 1 and 1000 GHz are accepted and finite', () => {
    for (const f of [1, 1000]) {
      const { k, alpha } = rainCoefficients({ frequencyGHz: f, elevationDeg: 10, tiltDeg: 45 });
      expect(Number.isFinite(k) && k > 0 && Number.isFinite(alpha)).toBe(true);
    }
  });
});
