import { MAP_DATA_VERSION, mapRecommendations, siteAtmosphere, siteClimate, siteMaps, withRainRate, type SiteClimate, type SiteClimateMaps } from '@/server/climate-maps';
import type { RainClimateInput } from '@/server/engine/rain-climate-source';
import type { SiteAtmosphere } from '@/server/engine/site-atmosphere';
import type { ClimateSnapshot, SiteMapsSnapshot } from './snapshot';

/** What the study form and every screen call the default climate source. */
export const MAPS_CLIMATE_NAME = "From the site's coordinates (ITU-R maps)";

/** The figures a study keeps when its rain climate came from the ITU-R maps at the site. */
export interface MapsClimateData {
  monthlyRainfallMm: number[];
  monthlyTemperatureC: number[];
  r001MmH: number;
  p0Percent: number;
  isothermHeightKm: number;
  rainHeightKm: number;
  topographicHeightKm: number;
  nWetMedian: number;
  /** Recommendation of each figure, e.g. { r001MmH: 'ITU-R P.837-7 Annex 1', … }. */
  sources: Record<string, string>;
  /** The Recommendations whose maps were read, then `maps:<hash>`: the map data this study used. */
  mapVersions: string[];
  mapDataVersion: string;
}

/**
 * The rain climate read from the ITU-R digital maps at the site (server/engine/README.md §1 default), as a
 * study snapshot. A site without map data (e.g. 88.9° N) throws EngineInputError on `site.latDeg`,
 * which the study form and the API turn into a 422.
 *
 * @example mapsClimateSnapshot(37.2, -25.4).data.r001MmH // => mm/h at that site
 */
export function mapsClimateSnapshot(latDeg: number, lonDeg: number, read?: SiteClimate): ClimateSnapshot {
  const c = read ?? siteClimate({ latDeg, lonDeg });
  const data: MapsClimateData = {
    monthlyRainfallMm: c.monthlyRainfallMm,
    monthlyTemperatureC: c.monthlyTemperatureC,
    r001MmH: c.r001MmH,
    p0Percent: c.p0Percent,
    isothermHeightKm: c.isothermHeightKm,
    rainHeightKm: c.rainHeightKm,
    topographicHeightKm: c.topographicHeightKm,
    nWetMedian: c.nWetMedian,
    sources: { ...c.sources },
    mapVersions: [...c.mapVersions],
    mapDataVersion: MAP_DATA_VERSION,
  };
  return {
    id: null,
    name: MAPS_CLIMATE_NAME,
    kind: 'itu-r-maps',
    data,
    zeroIsothermKm: c.isothermHeightKm,
    sourceNote: `ITU-R digital maps at ${latDeg.toFixed(4)}°, ${lonDeg.toFixed(4)}° (${c.mapVersions.join(', ')})`,
  };
}

/**
 * The maps' rain climate as the engine's rain input, without working out R0.01 here (the engine
 * does, once): the same input `rainInputOf` makes of a {@link mapsClimateSnapshot}.
 */
export function mapsRainInput(c: Pick<SiteClimateMaps, 'monthlyRainfallMm' | 'monthlyTemperatureC' | 'isothermHeightKm'>): RainClimateInput {
  return { monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC, origin: 'itu-r-maps', zeroIsothermHeightKm: c.isothermHeightKm };
}

/** Gases, clouds and scintillation inputs at the site and its station height (P.836-6, P.840-8, P.1510-1, P.453-14). */
export function mapsAtmosphere(latDeg: number, lonDeg: number, stationHeightKm: number): SiteAtmosphere {
  return siteAtmosphere({ latDeg, lonDeg, stationHeightKm });
}

/** The P.1511-1 topographic height at the site, m (rounded to 1 m): the default station altitude. */
export function mapsAltitudeM(latDeg: number, lonDeg: number): number {
  return siteMaps({ latDeg, lonDeg, atmosphere: false }).mapAltitudeM;
}

/** Everything a study reads from the ITU-R maps at its site, each map read once. */
export interface SiteMapsReading {
  /** The maps' rain climate, for a study without an override profile. */
  climate: ClimateSnapshot;
  /** Gases, clouds and scintillation inputs at the station height. */
  atmosphere: SiteAtmosphere;
  /** The record kept with the study (isothermUsed is decided by the caller). */
  siteMaps: Omit<SiteMapsSnapshot, 'isothermUsed'>;
}

/**
 * The ITU-R maps at a study's site and station height (siteMaps), as the study keeps them: its
 * snapshot stores the maps' R0.01 and P0, so they are worked out here (withRainRate).
 *
 * @example readSiteMaps(48.612, -21.847, 0.212).siteMaps.mapDataVersion // => MAP_DATA_VERSION
 */
export function readSiteMaps(latDeg: number, lonDeg: number, stationHeightKm: number): SiteMapsReading {
  const maps = siteMaps({ latDeg, lonDeg, stationHeightKm });
  const c = maps.climate;
  return {
    climate: mapsClimateSnapshot(latDeg, lonDeg, withRainRate(c)),
    atmosphere: maps.atmosphere!,
    siteMaps: {
      isothermHeightKm: c.isothermHeightKm,
      topographicHeightKm: c.topographicHeightKm,
      nWetMedian: c.nWetMedian,
      mapVersions: [...mapRecommendations, `maps:${MAP_DATA_VERSION}`],
      mapDataVersion: MAP_DATA_VERSION,
    },
  };
}
