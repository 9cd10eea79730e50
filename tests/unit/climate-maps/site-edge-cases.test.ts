import { describe, expect, it, vi } from 'vitest';
import { reducedCloudLiquidAt, siteAtmosphere, siteClimate, vapourAt } from '@/server/climate-maps';
import { isEngineInputError } from '@/server/engine/errors';

function refusal(run: () => unknown): { field: string; message: string } {
  try {
    run();
  } catch (e) {
    expect(isEngineInputError(e), String(e)).toBe(true);
    return e as { field: string; message: string };
  }
  throw new Error('expected an EngineInputError, got a result');
}

describe('edge cases', () => {
  it('loads each grid once: a second look-up reads no file', async () => {
    // The unit project shares modules between files (isolate: false), so this test takes a fresh
    // copy of the maps module whose grid cache and counter start empty.
    vi.resetModules();
    const { gridLoadCount, siteAtmosphere, siteClimate, vapourAt } = await import('@/server/climate-maps');
    expect(gridLoadCount()).toBe(0);
    siteClimate({ latDeg: 51.5, lonDeg: -0.14 });
    const afterClimate = gridLoadCount();
    // h0, height, N_wet, annual T, 12 MT, 12 T.
    expect(afterClimate).toBe(28);
    siteClimate({ latDeg: -33.9, lonDeg: 151.2 });
    siteClimate({ latDeg: 51.5, lonDeg: -0.14 });
    expect(gridLoadCount()).toBe(afterClimate);
    siteAtmosphere({ latDeg: 3.133, lonDeg: 101.7, stationHeightKm: 0.05 });
    const afterAtmosphere = gridLoadCount();
    // 18 p × (ρ, V, vsch, L_red); topography, N_wet and annual T are already held.
    expect(afterAtmosphere).toBe(afterClimate + 72);
    siteAtmosphere({ latDeg: 41.9, lonDeg: 12.49, stationHeightKm: 0.05 });
    vapourAt({ latDeg: 41.9, lonDeg: 12.49, stationHeightKm: 0.05, pPercent: 0.15 });
    expect(gridLoadCount()).toBe(afterAtmosphere);
  });

  it('refuses 88.9° N where the P.836-6 and P.840-8 maps are blank, with a clear message', () => {
    // Row 88.875° N of those maps holds NaN from 37° E round to 359° E.
    for (const run of [
      () => siteAtmosphere({ latDeg: 88.9, lonDeg: 100, stationHeightKm: 0 }),
      () => vapourAt({ latDeg: 88.9, lonDeg: 100, stationHeightKm: 0, pPercent: 1 }),
      () => reducedCloudLiquidAt({ latDeg: 88.9, lonDeg: -60, pPercent: 0.5 }),
    ]) {
      const e = refusal(run);
      expect(e.field).toBe('site.latDeg');
      expect(e.message).toMatch(/no ITU-R map data at this site/);
      expect(e.message).toMatch(/geostationary satellites are not visible there anyway/);
      expect(e.message).not.toMatch(/NaN/);
    }
  });

  it('refuses a latitude or longitude that is not on the globe', () => {
    expect(refusal(() => siteClimate({ latDeg: Number.NaN, lonDeg: 0 })).field).toBe('site.latDeg');
    expect(refusal(() => siteClimate({ latDeg: 90.5, lonDeg: 0 })).field).toBe('site.latDeg');
    expect(refusal(() => siteClimate({ latDeg: 10, lonDeg: Number.POSITIVE_INFINITY })).field).toBe('site.lonDeg');
    expect(refusal(() => siteAtmosphere({ latDeg: 10, lonDeg: -181, stationHeightKm: 0 })).field).toBe('site.lonDeg');
    expect(refusal(() => siteClimate({ latDeg: '51.5' as unknown as number, lonDeg: 0 })).field).toBe('site.latDeg');
  });

  it('reads lon 359.9 as −0.1', () => {
    const east = siteClimate({ latDeg: 51.5, lonDeg: 359.9 });
    const west = siteClimate({ latDeg: 51.5, lonDeg: -0.1 });
    for (const key of ['isothermHeightKm', 'topographicHeightKm', 'nWetMedian', 'annualMeanTemperatureK', 'p0Percent', 'r001MmH'] as const) {
      expect(east[key], key).toBeCloseTo(west[key], 9);
    }
    east.monthlyRainfallMm.forEach((mt, m) => expect(mt, `MT ${m + 1}`).toBeCloseTo(west.monthlyRainfallMm[m], 9));
    const a = siteAtmosphere({ latDeg: 51.5, lonDeg: 359.9, stationHeightKm: 0.1 });
    const b = siteAtmosphere({ latDeg: 51.5, lonDeg: -0.1, stationHeightKm: 0.1 });
    a.levels.forEach((level, k) => expect(level.waterVapourContentKgM2).toBeCloseTo(b.levels[k].waterVapourContentKgM2, 9));
  });

  it('reads lon 180 and −180 alike, on every grid', () => {
    // Fiji's latitude: land, rain and cloud on both sides of the date line.
    const east = siteClimate({ latDeg: -17.8, lonDeg: 180 });
    const west = siteClimate({ latDeg: -17.8, lonDeg: -180 });
    expect(east).toEqual({ ...west, lonDeg: 180 });
    expect(east.r001MmH).toBeGreaterThan(0);
    expect(siteAtmosphere({ latDeg: -17.8, lonDeg: 180, stationHeightKm: 0 })).toEqual(siteAtmosphere({ latDeg: -17.8, lonDeg: -180, stationHeightKm: 0 }));
  });

  it('refuses a station height outside −0.5…9 km', () => {
    for (const h of [-0.6, 9.5, Number.NaN]) {
      const e = refusal(() => siteAtmosphere({ latDeg: 51.5, lonDeg: -0.14, stationHeightKm: h }));
      expect(e.field, String(h)).toBe('site.altitudeKm');
      expect(refusal(() => vapourAt({ latDeg: 51.5, lonDeg: -0.14, stationHeightKm: h, pPercent: 1 })).field).toBe('site.altitudeKm');
    }
    expect(siteAtmosphere({ latDeg: 31.5, lonDeg: 35.5, stationHeightKm: -0.4 }).levels).toHaveLength(18);
  });

  it('answers at the poles where its own maps hold data, never with NaN', () => {
    // P.839-4, P.1511-1, P.453-14, P.1510-1 and P.837-7 cover both poles; the result is finite.
    for (const latDeg of [90, -90, 88.9]) {
      const c = siteClimate({ latDeg, lonDeg: 100 });
      for (const v of [c.isothermHeightKm, c.topographicHeightKm, c.nWetMedian, c.annualMeanTemperatureK, c.p0Percent, c.r001MmH]) expect(Number.isFinite(v)).toBe(true);
    }
  });
});
