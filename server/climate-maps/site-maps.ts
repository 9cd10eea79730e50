import type { SiteAtmosphere } from '../engine/site-atmosphere';
import { siteAtmosphere } from './site-atmosphere';
import { siteClimateMaps, type SiteClimateMaps } from './site-climate';
import type { SiteCoordinates } from './site-input';

/** Input of {@link siteMaps}. */
export interface SiteMapsOptions extends SiteCoordinates {
  /** Station height, km above mean sea level; left out or null: the P.1511-1 topographic height to 1 m. */
  stationHeightKm?: number | null;
  /** False: no atmosphere (a rain-only scenario); its maps are then not read. */
  atmosphere?: boolean;
}

/** What the ITU-R maps give at a site and its station height. */
export interface SiteMaps {
  /** The climate maps at the site. R0.01 and P0 are not worked out here: `withRainRate` does it, or the engine from the monthly normals. */
  climate: SiteClimateMaps;
  /** The P.1511-1 topographic height rounded to 1 m, as a site stores its altitude. */
  mapAltitudeM: number;
  /** The station height the atmosphere is read at: the one given, else mapAltitudeM / 1000. */
  stationHeightKm: number;
  /** True when stationHeightKm is the P.1511-1 default. */
  stationHeightFromMap: boolean;
  /** Gases, clouds and scintillation inputs at the station height (P.836-6, P.840-8, P.1510-1, P.453-14); null when not asked for. */
  atmosphere: SiteAtmosphere | null;
}

/**
 * The one reading of "the ITU-R maps at the site" shared by a study, a campaign row and the
 * trade-off API: the climate maps (P.839-4, P.1511-1, P.453-14, P.1510-1, P.837-7 monthly), the
 * P.1511-1 altitude default to 1 m, and the atmosphere at the station height.
 *
 * Refusals (EngineInputError): coordinates off the globe (`site.latDeg`/`site.lonDeg`), a site
 * where a map is blank (`site.latDeg`; only the atmosphere maps are, along 88.875° N) and a
 * station height outside −0.5…9 km (`site.altitudeKm`). Each comes from one map set alone, so
 * the order the sets are read in does not change which refusal a site gets.
 *
 * @example siteMaps({ latDeg: 46.5, lonDeg: 3.25 }).mapAltitudeM // => 287
 * @example siteMaps({ latDeg: 46.5, lonDeg: 3.25, stationHeightKm: 0.22 }).atmosphere.levels.length // => 18
 */
export function siteMaps(o: SiteMapsOptions): SiteMaps {
  const site = { latDeg: o.latDeg, lonDeg: o.lonDeg };
  const climate = siteClimateMaps(site);
  const mapAltitudeM = Math.round(climate.topographicHeightKm * 1000);
  const given = o.stationHeightKm ?? null;
  const stationHeightKm = given ?? mapAltitudeM / 1000;
  const atmosphere = o.atmosphere === false ? null : siteAtmosphere({ ...site, stationHeightKm });
  return { climate, mapAltitudeM, stationHeightKm, stationHeightFromMap: given === null, atmosphere };
}
