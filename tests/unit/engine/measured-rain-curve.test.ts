import { describe, expect, it } from 'vitest';
import { EngineInputError, measuredRainCurve } from '@/server/engine';

// server/engine/README.md §1 source 2: interpolate log R linearly in log p; never extrapolate silently.
// The points below are invented demo data.
const POINTS = [
  { pPercent: 1, rainRateMmH: 3 },
  { pPercent: 0.1, rainRateMmH: 12 },
  { pPercent: 0.01, rainRateMmH: 40 },
  { pPercent: 0.001, rainRateMmH: 95 },
];

describe('measuredRainCurve (log-log interpolation, server/engine/README.md §1)', () => {
  const curve = measuredRainCurve({ points: POINTS });
  it('returns measured points exactly', () => {
    for (const pt of POINTS) expect(curve.rainRateAt(pt.pPercent)).toBe(pt.rainRateMmH);
  });
  it('interpolates linearly in log p vs log R: the log midpoint gives the geometric mean', () => {
    expect(curve.rainRateAt(Math.sqrt(0.1 * 0.01))).toBeCloseTo(Math.sqrt(12 * 40), 10);
  });
  it('accepts points in any order and reports the covered range', () => {
    const shuffled = measuredRainCurve({ points: [POINTS[2], POINTS[0], POINTS[3], POINTS[1]] });
    expect(shuffled.minPPercent).toBe(0.001);
    expect(shuffled.maxPPercent).toBe(1);
    expect(shuffled.rainRateAt(0.05)).toBeCloseTo(curve.rainRateAt(0.05), 12);
  });
});

describe('edge cases', () => {
  it('p outside the measured range is refused, not extrapolated', () => {
    const short = measuredRainCurve({ points: POINTS.slice(0, 2), field: 'rain.measuredCurve' });
    expect(short.covers(0.01)).toBe(false);
    try {
      short.rainRateAt(0.01);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe('rain.measuredCurve');
      expect((e as Error).message).toMatch(/not extrapolated/);
    }
  });

  it.each([
    [[POINTS[0]], 'measuredCurve'],
    [[POINTS[0], { pPercent: 0, rainRateMmH: 5 }], 'measuredCurve[1].pPercent'],
    [[POINTS[0], { pPercent: 0.1, rainRateMmH: 0 }], 'measuredCurve[1].rainRateMmH'],
    [[POINTS[0], { pPercent: Number.NaN, rainRateMmH: 5 }], 'measuredCurve[1].pPercent'],
    [[POINTS[0], { pPercent: 1, rainRateMmH: 5 }], 'measuredCurve[1].pPercent'],
    [[POINTS[0], { pPercent: 0.1, rainRateMmH: 2 }], 'measuredCurve[1].rainRateMmH'],
  ])('bad curve %# throws EngineInputError naming %s', (points, field) => {
    try {
      measuredRainCurve({ points });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });
});
