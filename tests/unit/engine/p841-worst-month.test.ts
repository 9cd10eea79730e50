import { describe, expect, it } from 'vitest';
import { EngineInputError, WORST_MONTH_BETA_P841, WORST_MONTH_Q1_P841, worstMonthPercent } from '@/server/engine';

// ITU-R P.841: p_w = Q1 p^(1−β) with the global rain values Q1 = 2.85, β = 0.13 — from memory
// (no copy of the Recommendation at hand); the cap Q ≤ 12, the flat Q from 3 to 30 % and the
// branch above 30 % (Q falling to 1 at 100 %) are also from memory.
describe('worstMonthPercent (ITU-R P.841, global rain values from memory)', () => {
  it('uses Q1 = 2.85 and β = 0.13 (from memory)', () => {
    expect(WORST_MONTH_Q1_P841).toBe(2.85);
    expect(WORST_MONTH_BETA_P841).toBe(0.13);
  });
  it.each([0.001, 0.01, 0.1, 1, 2.9])('p = %s %%: p_w = 2.85 p^0.87', (p) => {
    expect(worstMonthPercent({ pPercent: p })).toBeCloseTo(2.85 * p ** 0.87, 12);
  });
  it('the worst month is worse than the average month but by less than 12×', () => {
    for (const p of [0.001, 0.03, 0.5, 4]) {
      const pw = worstMonthPercent({ pPercent: p });
      expect(pw).toBeGreaterThan(p);
      expect(pw).toBeLessThanOrEqual(12 * p);
    }
  });
});

describe('edge cases', () => {
  it('p = 0 gives 0; p = 100 caps at 100', () => {
    expect(worstMonthPercent({ pPercent: 0 })).toBe(0);
    expect(worstMonthPercent({ pPercent: 100 })).toBe(100);
  });
  it('tiny p hits the Q = 12 cap (from memory)', () => {
    expect(worstMonthPercent({ pPercent: 1e-6 })).toBeCloseTo(12e-6, 15);
  });
  it('is continuous at 3 % and non-decreasing', () => {
    expect(worstMonthPercent({ pPercent: 3 + 1e-9 })).toBeCloseTo(worstMonthPercent({ pPercent: 3 }), 6);
    let last = 0;
    for (let p = 0; p <= 100; p += 0.25) {
      const pw = worstMonthPercent({ pPercent: p });
      expect(pw).toBeGreaterThanOrEqual(last);
      last = pw;
    }
  });
  it('above 30 % Q falls to 1 at 100 %, so p_w stays below 100 % for every p < 100 % (from memory)', () => {
    const q3 = 2.85 * 3 ** -0.13;
    expect(worstMonthPercent({ pPercent: 30 })).toBeCloseTo(q3 * 30, 9);
    expect(worstMonthPercent({ pPercent: 30 + 1e-9 })).toBeCloseTo(q3 * 30, 6);
    // Without the branch, Q held at Q_3 = 2.4 would put p_w at 100 % from p ≈ 42 %.
    for (const p of [42, 50, 70, 99]) expect(worstMonthPercent({ pPercent: p })).toBeLessThan(100);
    expect(worstMonthPercent({ pPercent: 50 })).toBeCloseTo(50 * q3 * (50 / 30) ** (Math.log10(q3) / Math.log10(0.3)), 9);
  });
  it('bad p throws EngineInputError naming pPercent', () => {
    for (const p of [-1, 101, Number.NaN]) {
      expect(() => worstMonthPercent({ pPercent: p })).toThrow(EngineInputError);
    }
  });
});
