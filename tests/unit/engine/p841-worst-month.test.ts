import { describe, expect, it } from 'vitest';
import { EngineInputError, WORST_MONTH_BETA_P841, WORST_MONTH_Q1_P841, worstMonthPercent } from '@/server/engine';

// ITU-R P.841: p_w = Q1 p^(1−β) with the global rain values Q1 = 2.85, β = 0.13 — from memory
// (no copy of the Recommendation at hand); the cap Q ≤ 12 and the flat Q above 3 % are also
// from memory.
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
  it('bad p throws EngineInputError naming pPercent', () => {
    for (const p of [-1, 101, Number.NaN]) {
      expect(() => worstMonthPercent({ pPercent: p })).toThrow(EngineInputError);
    }
  });
});
