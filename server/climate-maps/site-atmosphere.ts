import type { AtmosphereLevel, SiteAtmosphere } from '../engine/site-atmosphere';
import { bilinearAt } from './bilinear';
import { loadGrid } from './grid';
import { TABULATED_P_PERCENT } from './log-p-interpolation';
import { cloudLiquidAtLevel, cloudLiquidGrid } from './p840-8-cloud-liquid';
import { vapourAtLevel, vapourCell, vapourLevel } from './p836-6-water-vapour';
import { checkCoordinates, checkStationHeight, mapValueOrRefuse, type SiteCoordinates } from './site-input';

// The engine owns the shape (it consumes it); the maps layer only fills it in.
export type { AtmosphereLevel, SiteAtmosphere } from '../engine/site-atmosphere';

/** Input of {@link siteAtmosphere}. */
export interface SiteAtmosphereOptions extends SiteCoordinates {
  /** Station height, km above mean sea level (−0.5…9). */
  stationHeightKm: number;
}

/**
 * The atmosphere at a site from the ITU-R digital maps: annual mean surface temperature
 * (P.1510-1), median N_wet (P.453-14), and at each of the 18 tabulated p the station-height
 * ρ and V (P.836-6 rule of the maps README) and L_red (P.840-8). Blank maps (above 87.75° N),
 * coordinates off the globe or a station height outside −0.5…9 km throw EngineInputError.
 *
 * @example
 * const a = siteAtmosphere({ latDeg: 51.5, lonDeg: -0.14, stationHeightKm: 0.03138298 })
 * a.levels[0].waterVapourContentKgM2 // => 39.6424… (ITU-R SG 3 validation example, p = 0.1 %)
 */
export function siteAtmosphere(options: SiteAtmosphereOptions): SiteAtmosphere {
  checkCoordinates(options);
  const h = checkStationHeight(options.stationHeightKm);
  const { latDeg, lonDeg } = options;
  const cell = vapourCell(latDeg, lonDeg);
  const levels = new Array<AtmosphereLevel>(TABULATED_P_PERCENT.length);
  for (let k = 0; k < TABULATED_P_PERCENT.length; k++) {
    const vapour = vapourAtLevel(k, cell, h);
    const { density, content } = vapourLevel(k);
    levels[k] = {
      pPercent: TABULATED_P_PERCENT[k],
      surfaceVapourDensityGM3: mapValueOrRefuse(vapour.surfaceVapourDensityGM3, density.entry, options),
      waterVapourContentKgM2: mapValueOrRefuse(vapour.waterVapourContentKgM2, content.entry, options),
      reducedCloudLiquidKgM2: mapValueOrRefuse(cloudLiquidAtLevel(k, cell), cloudLiquidGrid(k).entry, options),
    };
  }
  const temperature = loadGrid('p1510-1-surface-temperature-annual.f32.gz');
  const nWet = loadGrid('p453-14-nwet-median.f32.gz');
  return {
    surfaceTemperatureK: mapValueOrRefuse(bilinearAt(temperature, latDeg, lonDeg), temperature.entry, options),
    nWetMedian: mapValueOrRefuse(bilinearAt(nWet, latDeg, lonDeg), nWet.entry, options),
    levels,
  };
}
