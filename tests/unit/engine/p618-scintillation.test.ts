import { describe, expect, it } from 'vitest';
import { EngineInputError, combinedFadeExceedance, prepareRainPath, rainAttenuation, scintillationFade } from '@/server/engine';
import { expectRelative, num, readReferenceCsv } from './reference-csv';

// Source: ITU-R Study Group 3 validation examples for Rec. ITU-R P.618-14 §2.4.1 scintillation,
// with the site's N_wet (ITU-R P.453); file itu-p618-scintillation.csv.
const SOURCE = 'ITU-R SG 3 validation examples, Rec. ITU-R P.618-14 scintillation';
const rows = readReferenceCsv('itu-p618-scintillation.csv');

const BASE = { frequencyGHz: 14.25, elevationDeg: 31.076991235657, diameterM: 1, efficiency: 0.65, nWet: 50.38926222, pPercent: 1 };

describe(`scintillationFade against ${SOURCE}`, () => {
  it('reads all 24 reference rows', () => {
    expect(rows).toHaveLength(24);
  });

  it.each(rows.map((r) => [r.site, r.frequency_ghz, r.p_percent, r] as const))('site %s, %s GHz, p = %s %%: A_s matches to 1e-4', (_s, _f, _p, row) => {
    const a = scintillationFade({
      frequencyGHz: num(row, 'frequency_ghz'),
      elevationDeg: num(row, 'elevation_deg'),
      diameterM: num(row, 'diameter_m'),
      efficiency: num(row, 'efficiency'),
      nWet: num(row, 'n_wet'),
      pPercent: num(row, 'p_percent'),
    });
    expectRelative(a, num(row, 'scintillation_db'), 1e-4, `A_s (${SOURCE})`);
  });
});

describe('scintillation behaviour (ITU-R P.618-14 §2.4.1)', () => {
  it('a larger aperture averages out more scintillation (step 6, g(x) falls with x)', () => {
    expect(scintillationFade({ ...BASE, diameterM: 2.4 })).toBeLessThan(scintillationFade({ ...BASE, diameterM: 0.6 }));
  });
  it('smaller p gives a deeper fade (step 8)', () => {
    expect(scintillationFade({ ...BASE, pPercent: 0.01 })).toBeGreaterThan(scintillationFade({ ...BASE, pPercent: 10 }));
  });
});

describe('rain + scintillation combined, ITU-R P.618-14 §2.5 without gases and clouds', () => {
  const V8 = { latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25, elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333 };
  const path = prepareRainPath(V8);
  it('with σ = 0 it is the rain-only inverse', () => {
    for (const a of [0.6, 2, 6.8, 14]) {
      expect(combinedFadeExceedance({ rainPath: path, scintillationSigmaDb: 0, attenuationDb: a }).pPercent).toBeCloseTo(path.exceedanceOf(a).pPercent, 10);
    }
  });
  it('the p it returns satisfies √(A_R(p)² + A_S(p)²) = A*', () => {
    const sigma = scintillationFade({ ...BASE, pPercent: 1 }) / 3; // a(1 %) = 3 (step 8)
    for (const a of [1, 3, 7]) {
      const { pPercent, bound } = combinedFadeExceedance({ rainPath: path, scintillationSigmaDb: sigma, attenuationDb: a });
      expect(bound).toBe('none');
      const as = scintillationFade({ ...BASE, pPercent });
      const ar = rainAttenuation({ ...V8, pPercent });
      expect(Math.sqrt(ar * ar + as * as)).toBeCloseTo(a, 9);
    }
  });
});

describe('edge cases', () => {
  it('combined inverse outside the model range reports bounds', () => {
    const path = prepareRainPath({ latDeg: 51.5, stationHeightKm: 0, frequencyGHz: 14.25, elevationDeg: 31, tiltDeg: 0, r001MmH: 26, rainHeightKm: 2.45 });
    expect(combinedFadeExceedance({ rainPath: path, scintillationSigmaDb: 0.09, attenuationDb: 100 })).toEqual({ pPercent: 0.001, bound: 'below-model-range' });
    expect(combinedFadeExceedance({ rainPath: path, scintillationSigmaDb: 0.09, attenuationDb: 0.01 })).toEqual({ pPercent: 5, bound: 'above-model-range' });
  });

  it('a huge aperture drives g(x) to zero rather than NaN (step 6: negative root argument → 0)', () => {
    expect(scintillationFade({ ...BASE, diameterM: 200, frequencyGHz: 50 })).toBe(0);
  });

  it.each([
    [{ pPercent: 0.0005 }, 'pPercent'],
    [{ pPercent: 60 }, 'pPercent'],
    [{ elevationDeg: 4.9 }, 'elevationDeg'],
    [{ diameterM: -1 }, 'diameterM'],
    [{ diameterM: 0 }, 'diameterM'],
    [{ efficiency: 1.2 }, 'efficiency'],
    [{ nWet: Number.NaN }, 'nWet'],
    [{ frequencyGHz: 70 }, 'frequencyGHz'],
  ])('%o throws EngineInputError naming %s', (patch, field) => {
    try {
      scintillationFade({ ...BASE, ...patch });
      expect.unreachable('should have thrown');
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });
});
