import { describe, expect, it } from 'vitest';
import {
  EngineInputError,
  dishBeamwidth,
  dishGain,
  downlinkDegradation,
  fadeThreshold,
  freeSpaceLoss,
  linkBudget,
  pointingLoss,
  systemNoiseTemperature,
} from '@/server/engine';

// Formulas of server/engine/README.md §3–§4: aperture gain and free-space loss are textbook physics
// (ITU-R P.525 for free space); 70 λ/D beamwidth, 12 (θe/θ3dB)² pointing loss and T_m = 275 K
// are common practice, no source. Expected values below are worked by hand in the test.
const C = 299_792_458;

describe('dish gain, beamwidth and pointing loss (server/engine/README.md §3)', () => {
  it('G = 10 log10(η (π D f / c)²): 1.2 m, η 0.65, 12 GHz ≈ 41.70 dBi (hand calculation)', () => {
    const expected = 10 * Math.log10(0.65 * ((Math.PI * 1.2 * 12e9) / C) ** 2);
    expect(dishGain({ diameterM: 1.2, efficiency: 0.65, frequencyGHz: 12 })).toBeCloseTo(expected, 12);
    expect(expected).toBeCloseTo(41.70, 2);
  });
  it('doubling the diameter adds 20 log10 2 ≈ 6.02 dB', () => {
    const a = dishGain({ diameterM: 0.6, efficiency: 0.7, frequencyGHz: 20 });
    const b = dishGain({ diameterM: 1.2, efficiency: 0.7, frequencyGHz: 20 });
    expect(b - a).toBeCloseTo(20 * Math.log10(2), 12);
  });
  it('beamwidth 70 λ/D: 1.2 m at 12 GHz ≈ 1.457° (common practice, no source)', () => {
    expect(dishBeamwidth({ diameterM: 1.2, frequencyGHz: 12 })).toBeCloseTo((70 * (C / 12e9)) / 1.2, 12);
    expect(dishBeamwidth({ diameterM: 1.2, frequencyGHz: 12 })).toBeCloseTo(1.457, 3);
  });
  it('pointing loss 12 (θe/θ3dB)²: an error of half a beamwidth costs 3 dB (common practice, no source)', () => {
    expect(pointingLoss({ pointingErrorDeg: 0.5, beamwidthDeg: 1 })).toBeCloseTo(3, 12);
    expect(pointingLoss({ pointingErrorDeg: 0, beamwidthDeg: 1 })).toBe(0);
  });
});

describe('free-space loss and the clear-sky link budget (server/engine/README.md §4)', () => {
  it('L_fs = 20 log10(4π d f / c): 38 000 km at 12 GHz ≈ 205.63 dB', () => {
    expect(freeSpaceLoss({ rangeKm: 38000, frequencyGHz: 12 })).toBeCloseTo(20 * Math.log10((4 * Math.PI * 38e6 * 12e9) / C), 10);
    expect(freeSpaceLoss({ rangeKm: 38000, frequencyGHz: 12 })).toBeCloseTo(205.63, 2);
  });
  it('C/N0 = EIRP − L + G/T + 228.6; Es/N0 = C/N0 − 10 log10 Rs; margin = Es/N0 − required − implementation', () => {
    const lb = linkBudget({ eirpDbw: 52, freeSpaceLossDb: 205.6, otherLossesDb: 0.4, gOverTDbK: 19.1, symbolRateMsps: 30, requiredEsN0Db: 7.91, implementationMarginDb: 1 });
    expect(lb.cOverN0DbHz).toBeCloseTo(52 - 206 + 19.1 + 228.6, 10);
    expect(lb.esN0Db).toBeCloseTo(lb.cOverN0DbHz - 10 * Math.log10(30e6), 10);
    expect(lb.marginDb).toBeCloseTo(lb.esN0Db - 8.91, 10);
  });
});

describe('noise in rain and the fade threshold (server/engine/README.md §4)', () => {
  const rx = { lnbNoiseTempK: 50, antennaNoiseTempK: 30 };
  it('T_sys(A) = T_rx + T_ant 10^(−A/10) + 275 (1 − 10^(−A/10)), T_m default 275 K (common practice)', () => {
    const x = 10 ** -0.3;
    expect(systemNoiseTemperature({ ...rx, attenuationDb: 3 })).toBeCloseTo(50 + 30 * x + 275 * (1 - x), 10);
    expect(systemNoiseTemperature({ ...rx, attenuationDb: 0 })).toBe(80);
  });
  it('DND(A) = A + 10 log10(T_sys(A)/T_sys(0)) exceeds A when the rain is warmer than the clear sky', () => {
    const d = downlinkDegradation({ ...rx, attenuationDb: 3 });
    expect(d).toBeGreaterThan(3);
    expect(d).toBeCloseTo(3 + 10 * Math.log10(systemNoiseTemperature({ ...rx, attenuationDb: 3 }) / 80), 12);
  });
  it('the exact fade threshold A* satisfies DND(A*) = margin to 1e-10 for margins 0.1–30 dB', () => {
    for (const m of [0.1, 0.5, 1, 3, 7.63, 12, 20, 30]) {
      for (const temps of [rx, { lnbNoiseTempK: 120, antennaNoiseTempK: 60, mediumTempK: 260 }, { lnbNoiseTempK: 20, antennaNoiseTempK: 300 }]) {
        const a = fadeThreshold({ ...temps, marginDb: m })!;
        expect(a).toBeGreaterThan(0);
        expect(downlinkDegradation({ ...temps, attenuationDb: a })).toBeCloseTo(m, 10);
      }
    }
  });
  it('without noise increase (uplink: the satellite looks at a warm Earth) A* equals the margin', () => {
    expect(fadeThreshold({ ...rx, marginDb: 4.2, noiseIncrease: false })).toBe(4.2);
  });
});

describe('edge cases', () => {
  it('no clear-sky margin means no fade threshold: null, never a negative number', () => {
    expect(fadeThreshold({ ...{ lnbNoiseTempK: 50, antennaNoiseTempK: 30 }, marginDb: 0 })).toBeNull();
    expect(fadeThreshold({ lnbNoiseTempK: 50, antennaNoiseTempK: 30, marginDb: -2 })).toBeNull();
    expect(fadeThreshold({ lnbNoiseTempK: 50, antennaNoiseTempK: 30, marginDb: -2, noiseIncrease: false })).toBeNull();
  });

  it.each([
    [() => dishGain({ diameterM: -1.2, efficiency: 0.65, frequencyGHz: 12 }), 'diameterM'],
    [() => dishGain({ diameterM: 1.2, efficiency: 0, frequencyGHz: 12 }), 'efficiency'],
    [() => dishGain({ diameterM: 1.2, efficiency: 1.1, frequencyGHz: 12 }), 'efficiency'],
    [() => dishBeamwidth({ diameterM: Number.NaN, frequencyGHz: 12 }), 'diameterM'],
    [() => pointingLoss({ pointingErrorDeg: -0.1, beamwidthDeg: 1 }), 'pointingErrorDeg'],
    [() => freeSpaceLoss({ rangeKm: 0, frequencyGHz: 12 }), 'rangeKm'],
    [() => linkBudget({ eirpDbw: 50, freeSpaceLossDb: 205, gOverTDbK: 18, symbolRateMsps: 0, requiredEsN0Db: 5 }), 'symbolRateMsps'],
    [() => systemNoiseTemperature({ lnbNoiseTempK: 0, antennaNoiseTempK: 30, attenuationDb: 1 }), 'lnbNoiseTempK'],
    [() => fadeThreshold({ lnbNoiseTempK: 50, antennaNoiseTempK: 30, marginDb: Number.NaN }), 'marginDb'],
  ])('bad input %# throws EngineInputError naming %s', (call, field) => {
    try {
      call();
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });
});
