import { describe, expect, it } from 'vitest';
import { brentRoot } from '@/server/engine/math/brent';
import { erfc, erfcContinuedFraction, erfSeries, normalTail } from '@/server/engine/math/normal-tail';

// erfc values: standard tables (from memory, to the digits shown); the series and continued
// fraction are also checked against each other where both converge.
describe('erfc and the normal tail', () => {
  it.each([
    [0, 1],
    [0.5, 0.4795001221869535],
    [1, 0.15729920705028513],
    [2, 0.004677734981047266],
    [3, 2.209049699858544e-5],
    [5, 1.5374597944280349e-12],
  ])('erfc(%s) = %s (tables, from memory)', (x, v) => {
    expect(Math.abs(erfc(x) / v - 1)).toBeLessThan(1e-13);
  });
  it('series and continued fraction agree to 1e-13 relative around the 1.2 switch point (0.8–1.8)', () => {
    for (let x = 0.8; x <= 1.8; x += 0.05) {
      const a = 1 - erfSeries(x);
      const b = erfcContinuedFraction(x);
      expect(Math.abs(a / b - 1)).toBeLessThan(1e-13);
    }
  });
  it('Q(−z) = 1 − Q(z) and Q(0) = 0.5', () => {
    expect(normalTail(0)).toBe(0.5);
    for (const z of [0.3, 1.7, 4]) expect(normalTail(-z) + normalTail(z)).toBeCloseTo(1, 14);
  });
});

describe('brentRoot', () => {
  it('finds √2 and a root of cos x = x', () => {
    expect(brentRoot((x) => x * x - 2, 0, 2, 1e-14)).toBeCloseTo(Math.SQRT2, 13);
    const r = brentRoot((x) => Math.cos(x) - x, 0, 1, 1e-14);
    expect(Math.cos(r) - r).toBeCloseTo(0, 13);
  });
});

describe('edge cases', () => {
  it('erfc far in the tails: 0 and 2, never NaN', () => {
    expect(erfc(40)).toBe(0);
    expect(erfc(-40)).toBe(2);
  });
  it('brentRoot refuses an unbracketed interval and accepts a root at an end', () => {
    expect(() => brentRoot((x) => x * x + 1, -1, 1, 1e-12)).toThrow(/not bracketed/);
    expect(brentRoot((x) => x - 1, 1, 2, 1e-12)).toBe(1);
  });
});

describe('erfc through the Chebyshev tables equals the series and the continued fraction', () => {
  it('to 2e-14 relative at 6 000 points of 0 ≤ x ≤ 26 (the tables are built from the series and the continued fraction)', () => {
    let worst = 0;
    for (let i = 0; i <= 6000; i++) {
      const x = (26 * i) / 6000;
      const fast = erfc(x);
      const exact = x < 1.2 ? 1 - erfSeries(x) : erfcContinuedFraction(x);
      if (exact > 0) worst = Math.max(worst, Math.abs(fast / exact - 1));
    }
    expect(worst).toBeLessThan(2e-14);
  });
});
