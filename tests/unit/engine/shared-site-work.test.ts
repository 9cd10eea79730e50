import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSiteAtmosphere, EngineInputError, prepareAtmosphericPath, totalAttenuationCurve } from '@/server/engine';
import { rainOnHeldScan } from '@/server/engine/p618-total-attenuation';
import { sampleCurve, scanGrid } from '@/server/engine/math/largest-crossing';
import { prepareRainPathUnchecked } from '@/server/engine/p618-rain-path';
import type { SiteAtmosphere } from '@/server/engine/site-atmosphere';

// The work the dishes of one site share (issue 13: a campaign's speed) must give the very numbers
// the per-dish computation gave: these are equalities of doubles, not tolerances. No source needed.
const RUNS = { numRuns: 200, seed: 20261202 };

/** An invented mid-latitude atmosphere (demo-like values, not from a map). */
function atmosphere(scale = 1): SiteAtmosphere {
  const ps = [0.1, 0.2, 0.3, 0.5, 1, 2, 3, 5, 10, 20, 30, 50, 60, 70, 80, 90, 95, 99];
  return {
    surfaceTemperatureK: 288.4,
    nWetMedian: 48.7,
    levels: ps.map((p, i) => ({ pPercent: p, surfaceVapourDensityGM3: scale * (19 - i * 0.6), waterVapourContentKgM2: scale * (44 - i * 1.7), reducedCloudLiquidKgM2: scale * (1.6 - i * 0.08) })),
  };
}

const pathArb = fc.record({
  latDeg: fc.double({ min: -60, max: 60, noNaN: true }),
  stationHeightKm: fc.double({ min: 0, max: 1.5, noNaN: true }),
  frequencyGHz: fc.double({ min: 4, max: 30, noNaN: true }),
  elevationDeg: fc.double({ min: 5, max: 85, noNaN: true }),
  tiltDeg: fc.constantFrom(0, 45, 90),
  r001MmH: fc.double({ min: 5, max: 150, noNaN: true }),
  rainHeightKm: fc.double({ min: 2.6, max: 5.2, noNaN: true }),
});

describe('work shared by the dishes of one site', () => {
  it('sampleCurve with values handed in on its grid equals sampleCurve evaluating g itself', () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0.05, max: 2, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), (centre, width, level) => {
        const g = (x: number) => Math.exp(-(((x - centre) / width) ** 2)) - 0.1 * x;
        const grid = scanGrid(-4, 4);
        const plain = sampleCurve(g, -4, 4);
        const handed = sampleCurve(g, -4, 4, (i) => g(grid[i]));
        expect(Array.from(handed.gs)).toEqual(Array.from(plain.gs));
        expect([handed.peak, handed.peakX]).toEqual([plain.peak, plain.peakX]);
        expect(handed.largestReaching(level)).toEqual(plain.largestReaching(level));
      }),
      RUNS,
    );
  });

  it("a dish's P.618 §2.5 total curve with the rain scan shared between dishes equals the same dish working out its own", () => {
    const dishSigmas = fc.array(fc.double({ min: 0, max: 0.6, noNaN: true }), { minLength: 2, maxLength: 8 });
    fc.assert(
      fc.property(pathArb, dishSigmas, fc.double({ min: 0.05, max: 40, noNaN: true }), (path, sigmas, thresholdDb) => {
        const atm = atmosphere();
        const shared = prepareRainPathUnchecked(path);
        const scan = rainOnHeldScan(shared);
        const atmPath = prepareAtmosphericPath({ frequencyGHz: path.frequencyGHz, elevationDeg: path.elevationDeg, stationHeightKm: path.stationHeightKm, atmosphere: atm });
        for (const sigma of sigmas) {
          const onShared = totalAttenuationCurve({ rainPath: shared, atmosphericPath: atmPath, scintillationSigmaDb: sigma, rainOnHeldScan: scan });
          const own = totalAttenuationCurve({
            rainPath: prepareRainPathUnchecked(path),
            atmosphericPath: prepareAtmosphericPath({ frequencyGHz: path.frequencyGHz, elevationDeg: path.elevationDeg, stationHeightKm: path.stationHeightKm, atmosphere: atm }),
            scintillationSigmaDb: sigma,
          });
          expect(onShared.exceedanceOf(thresholdDb)).toEqual(own.exceedanceOf(thresholdDb));
          expect(onShared.maxAttenuationDb).toBe(own.maxAttenuationDb);
        }
      }),
      RUNS,
    );
  });

  it('checkSiteAtmosphere hands back a valid atmosphere as given', () => {
    const atm = atmosphere();
    expect(checkSiteAtmosphere(atm)).toBe(atm);
  });

  it.each([
    ['surfaceTemperatureK', (a: SiteAtmosphere) => ({ ...a, surfaceTemperatureK: Number.NaN }), 'atmosphere.surfaceTemperatureK'],
    ['nWetMedian out of range', (a: SiteAtmosphere) => ({ ...a, nWetMedian: 250 }), 'atmosphere.nWetMedian'],
    ['one level', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.slice(0, 1) }), 'atmosphere.levels'],
    ['a level p out of order', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.map((l, i) => (i === 3 ? { ...l, pPercent: 0.15 } : l)) }), 'atmosphere.levels[3].pPercent'],
    ['a vapour density as text', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.map((l, i) => (i === 5 ? { ...l, surfaceVapourDensityGM3: '12' as unknown as number } : l)) }), 'atmosphere.levels[5].surfaceVapourDensityGM3'],
    ['negative cloud liquid', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.map((l, i) => (i === 7 ? { ...l, reducedCloudLiquidKgM2: -1 } : l)) }), 'atmosphere.levels[7].reducedCloudLiquidKgM2'],
    ['a null level', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.map((l, i) => (i === 2 ? null : l)) as never }), 'atmosphere.levels[2]'],
    ['first level above 1 %', (a: SiteAtmosphere) => ({ ...a, levels: a.levels.slice(5) }), 'atmosphere.levels[0].pPercent'],
  ])('checkSiteAtmosphere still names the field of a bad value: %s', (_, spoil, field) => {
    let error: unknown;
    try {
      checkSiteAtmosphere(spoil(atmosphere()));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(EngineInputError);
    expect((error as EngineInputError).field).toBe(field);
  });
});
