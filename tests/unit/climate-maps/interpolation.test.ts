import { describe, expect, it } from 'vitest';
import { keysWeight } from '@/server/climate-maps/bicubic-p1144';
import { betweenTabulated, logPBracket, TABULATED_P_PERCENT } from '@/server/climate-maps/log-p-interpolation';
import { wrapLongitude } from '@/server/climate-maps/grid';
import { isEngineInputError } from '@/server/engine/errors';

/** The building blocks of the map rules, checked against the properties their sources state. */
describe('interpolation building blocks', () => {
  it('the P.1144 bicubic kernel (Keys, a = −0.5) is 1 at its own point, 0 at the others, and its weights sum to 1', () => {
    // Rec. ITU-R P.1144 Annex 1: K(0) = 1, K(±1) = K(±2) = 0, so grid values are reproduced exactly.
    expect(keysWeight(0)).toBe(1);
    expect(keysWeight(1)).toBe(0);
    expect(keysWeight(-2)).toBe(0);
    expect(keysWeight(2.5)).toBe(0);
    for (const d of [0.1, 0.25, 0.5, 0.73, 0.99]) {
      const weights = [keysWeight(d + 1), keysWeight(d), keysWeight(d - 1), keysWeight(d - 2)];
      expect(weights.reduce((a, b) => a + b), `Σ at ${d}`).toBeCloseTo(1, 14);
      // With a = −0.5 the kernel reproduces straight lines (and quadratics) exactly (Keys 1981).
      const line = weights.reduce((sum, w, n) => sum + w * (3 + 2 * (n - 1)), 0);
      expect(line, `line at ${d}`).toBeCloseTo(3 + 2 * d, 12);
      const quadratic = weights.reduce((sum, w, n) => sum + w * (n - 1) ** 2, 0);
      expect(quadratic, `quadratic at ${d}`).toBeCloseTo(d * d, 12);
    }
  });

  it('brackets p among the tabulated p and interpolates linearly in ln p', () => {
    expect(logPBracket(1)).toEqual({ lower: 4, upper: 4, t: 0 });
    const b = logPBracket(0.15);
    expect([b.lower, b.upper]).toEqual([0, 1]);
    expect(b.t).toBeCloseTo(Math.log(1.5) / Math.log(2), 14);
    // The geometric mean of two tabulated p lies halfway in ln p.
    expect(betweenTabulated(logPBracket(Math.sqrt(0.2 * 0.3)), 10, 20)).toBeCloseTo(15, 12);
    expect(logPBracket(99)).toEqual({ lower: TABULATED_P_PERCENT.length - 1, upper: TABULATED_P_PERCENT.length - 1, t: 0 });
  });

  it('refuses p outside 0.1…99 % rather than extrapolating', () => {
    for (const p of [0.09, 99.5, Number.NaN, 0]) {
      let error: unknown;
      try {
        logPBracket(p);
      } catch (e) {
        error = e;
      }
      expect(isEngineInputError(error), String(p)).toBe(true);
      expect((error as { field: string }).field).toBe('pPercent');
    }
  });

  it('wraps longitude into the grid range', () => {
    expect(wrapLongitude(-0.14, 0)).toBeCloseTo(359.86, 12);
    expect(wrapLongitude(359.9, -180.125)).toBeCloseTo(-0.1, 12);
    expect(wrapLongitude(360, 0)).toBe(0);
    expect(wrapLongitude(-180, -180)).toBe(-180);
    expect(wrapLongitude(180, -180)).toBe(-180);
    expect(wrapLongitude(-1e-14, 0)).toBeLessThan(360);
  });
});
