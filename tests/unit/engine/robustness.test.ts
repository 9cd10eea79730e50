import { describe, expect, it } from 'vitest';
import {
  dishTradeoff,
  EngineInputError,
  monthlyRainClimate,
  prepareRainPath,
  rainAttenuation,
  rainExceedance,
  resolveRainClimate,
  worstMonthPercent,
} from '@/server/engine';
import { brentRoot, SolverNumericError } from '@/server/engine/math/brent';
import { sampleCurve } from '@/server/engine/math/largest-crossing';
import { demoScenario } from './tradeoff-fixture';

const baseScenario = demoScenario();

// Defects found by review of the engine (issue "every figure from the site's own climate", part 2).
// Each check below failed on the code before the fix; the numbers are invented test inputs, and
// the expectations follow from the methods themselves (no outside figure is needed).

function fieldOf(run: () => unknown): string {
  try {
    run();
  } catch (e) {
    if (e instanceof EngineInputError) return e.field;
    throw e;
  }
  throw new Error('expected an EngineInputError');
}

describe('the inverse where ITU-R P.618-14 step 10 is not monotone', () => {
  // Equator, low elevation, heavy rain: β = −0.005(|φ| − 36) + 1.8 − 4.25 sin θ is large, and A_p
  // rises again just above 0.001 % (found by the property test of the inverse).
  const path = { latDeg: 0, stationHeightKm: 0, frequencyGHz: 8.532388808676176, elevationDeg: 7.205769280422482, tiltDeg: 0, r001MmH: 199.99577748898392, rainHeightKm: 3.811947167677008 };
  const a0001 = rainAttenuation({ ...path, pPercent: 0.001 });
  const peak = prepareRainPath(path).maxAttenuationDb;

  it('A_p really rises above p = 0.001 % here (the premise)', () => {
    expect(peak).toBeGreaterThan(a0001 * (1 + 1e-6));
  });

  it('an attenuation between A_0.001 and the peak has a real p: not "below model range"', () => {
    const a = (a0001 + peak) / 2;
    const ex = rainExceedance({ ...path, attenuationDb: a });
    expect(ex.bound).toBe('none');
    expect(ex.pPercent).toBeGreaterThan(0.001);
    expect(rainAttenuation({ ...path, pPercent: ex.pPercent })).toBeCloseTo(a, 9);
  });

  it('the answer is the LARGEST p reaching the attenuation', () => {
    const ex = rainExceedance({ ...path, attenuationDb: a0001 });
    expect(ex.pPercent).toBeGreaterThan(0.001);
    // every p above the answer has less attenuation
    for (let k = 1; k <= 20; k++) {
      const p = ex.pPercent * (1 + 0.05 * k);
      if (p > 5) break;
      expect(rainAttenuation({ ...path, pPercent: p })).toBeLessThan(a0001);
    }
  });

  it('above the peak it is below the model range', () => {
    expect(rainExceedance({ ...path, attenuationDb: peak * 1.01 })).toEqual({ pPercent: 0.001, bound: 'below-model-range' });
  });
});

describe('NaN inside a solver is an error, never a plausible p', () => {
  it('brentRoot throws SolverNumericError when the function gives NaN', () => {
    expect(() => brentRoot((x) => (x > 0.5 ? Number.NaN : x - 0.7), 0, 1, 1e-12)).toThrow(SolverNumericError);
    expect(() => brentRoot(() => Number.NaN, 0, 1, 1e-12)).toThrow(SolverNumericError);
  });
  it('the curve scan refuses NaN anywhere on the grid', () => {
    expect(() => sampleCurve((x) => (x > 2 ? Number.NaN : -x), 0, 3)).toThrow(SolverNumericError);
  });
  it('a rain rate that underflows (5e-324 mm/h) is no rain: no NaN reaches the inverse', () => {
    const ex = rainExceedance({ latDeg: 0, stationHeightKm: 0, frequencyGHz: 12, elevationDeg: 40, tiltDeg: 0, r001MmH: 5e-324, rainHeightKm: 4, attenuationDb: 1 });
    expect(ex).toEqual({ pPercent: 0.001, bound: 'below-model-range' });
  });
});

describe('every input has a physical range, checked before any arithmetic', () => {
  const s = baseScenario;
  it.each([
    ['downlink.tiltDeg', { downlink: { ...s.downlink, tiltDeg: 1e308 } }],
    ['downlink.eirpDbw', { downlink: { ...s.downlink, eirpDbw: 1e6 } }],
    ['downlink.requiredEsN0Db', { downlink: { ...s.downlink, requiredEsN0Db: 500 } }],
    ['downlink.symbolRateMsps', { downlink: { ...s.downlink, symbolRateMsps: 1e9 } }],
    ['downlink.otherLossesDb', { downlink: { ...s.downlink, otherLossesDb: 1e5 } }],
    ['downlink.implementationMarginDb', { downlink: { ...s.downlink, implementationMarginDb: 1e5 } }],
    ['receiver.lnbNoiseTempK', { receiver: { ...s.receiver, lnbNoiseTempK: 1e12 } }],
    ['receiver.antennaNoiseTempK', { receiver: { ...s.receiver, antennaNoiseTempK: 1e12 } }],
    ['receiver.mediumTempK', { receiver: { ...s.receiver, mediumTempK: 1e12 } }],
    ['dishes[0].diameterM', { dishes: [{ diameterM: 100, efficiency: 0.65 }] }],
    ['dishes[0].diameterM', { dishes: [{ diameterM: 1e308, efficiency: 0.65 }] }],
    ['rain.r001MmH', { rain: { r001MmH: 35000, rainHeightKm: 3 } }],
  ])('%s out of range → EngineInputError naming it', (field, patch) => {
    expect(fieldOf(() => dishTradeoff({ ...s, ...patch } as typeof s))).toBe(field);
  });

  it('monthly rainfall of 1e6 mm is refused at the door (it gave R0.01 = 85 000 mm/h)', () => {
    const rain = { monthlyRainfallMm: new Array(12).fill(1e6), monthlyTemperatureC: new Array(12).fill(25) };
    expect(fieldOf(() => monthlyRainClimate(rain))).toBe('monthlyRainfallMm[0]');
    expect(fieldOf(() => resolveRainClimate(rain))).toBe('rain.monthlyRainfallMm[0]');
  });

  it('a DERIVED R0.01 above the physical range names its source (normals within range per month, but extreme)', () => {
    // 4 900 mm every month at 30 °C passes the per-month range; Annex 1 then gives an R0.01 far above 300 mm/h.
    const rain = { monthlyRainfallMm: new Array(12).fill(4900), monthlyTemperatureC: new Array(12).fill(30) };
    expect(monthlyRainClimate(rain).rainRateExceeded(0.01)).toBeGreaterThan(300);
    expect(fieldOf(() => resolveRainClimate(rain))).toBe('rain.monthlyRainfallMm');
  });

  it('a measured curve with impossible rain rates is refused', () => {
    const rain = { measuredCurve: [{ pPercent: 0.1, rainRateMmH: 10 }, { pPercent: 0.001, rainRateMmH: 1e7 }] };
    expect(fieldOf(() => resolveRainClimate(rain))).toBe('rain.measuredCurve[1].rainRateMmH');
  });
});

describe('ITU-R P.841 above 30 % (from memory)', () => {
  it('has a branch there: the worst month stays below 100 % until p = 100 %', () => {
    expect(worstMonthPercent({ pPercent: 45 })).toBeLessThan(100);
    expect(worstMonthPercent({ pPercent: 100 })).toBeCloseTo(100, 9);
  });
});

describe('edge cases', () => {
  it('a tilt within range still works and folds like cos 2τ', () => {
    const a = dishTradeoff({ ...baseScenario, downlink: { ...baseScenario.downlink, tiltDeg: 10 } });
    const b = dishTradeoff({ ...baseScenario, downlink: { ...baseScenario.downlink, tiltDeg: 190 } });
    expect(b.options[0].outagePercent).toBeCloseTo(a.options[0].outagePercent, 12);
  });
});
