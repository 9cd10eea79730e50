import { EngineInputError } from '../engine/errors';
import type { MapEntry } from './map-catalogue';

/** A site by its coordinates: latitude −90…90° (north positive), longitude −180…360° (east positive). */
export interface SiteCoordinates {
  latDeg: number;
  lonDeg: number;
}

/** Station heights the maps are used for, km above mean sea level (Dead Sea shore to high plateaus). */
export const MIN_STATION_HEIGHT_KM = -0.5;
export const MAX_STATION_HEIGHT_KM = 9;

/**
 * Refuses coordinates that are not numbers or lie off the globe; longitudes 180…360° are taken
 * as east of Greenwich the other way round (359.9 is −0.1).
 *
 * @example
 * checkCoordinates({ latDeg: 51.5, lonDeg: -0.14 }) // passes
 * checkCoordinates({ latDeg: NaN, lonDeg: 0 })      // throws EngineInputError, field 'site.latDeg'
 */
export function checkCoordinates(site: SiteCoordinates): void {
  const { latDeg, lonDeg } = site;
  if (typeof latDeg !== 'number' || !Number.isFinite(latDeg) || latDeg < -90 || latDeg > 90) {
    throw new EngineInputError('site.latDeg', `no ITU-R map data at this site (latitude must be a number from −90 to 90°; got ${latDeg})`, latDeg);
  }
  if (typeof lonDeg !== 'number' || !Number.isFinite(lonDeg) || lonDeg < -180 || lonDeg > 360) {
    throw new EngineInputError('site.lonDeg', `no ITU-R map data at this site (longitude must be a number from −180 to 360°; got ${lonDeg})`, lonDeg);
  }
}

/**
 * Refuses a station height outside −0.5…9 km: the vapour maps are scaled to it with the
 * scale height of P.836-6, which means nothing far outside the inhabited range.
 *
 * @example
 * checkStationHeight(0.031) // => 0.031
 * checkStationHeight(12)    // throws EngineInputError, field 'site.altitudeKm'
 */
export function checkStationHeight(stationHeightKm: number): number {
  if (typeof stationHeightKm !== 'number' || !Number.isFinite(stationHeightKm) || stationHeightKm < MIN_STATION_HEIGHT_KM || stationHeightKm > MAX_STATION_HEIGHT_KM) {
    throw new EngineInputError(
      'site.altitudeKm',
      `station height must be a number from ${MIN_STATION_HEIGHT_KM} to ${MAX_STATION_HEIGHT_KM} km; got ${stationHeightKm}`,
      stationHeightKm,
    );
  }
  return stationHeightKm;
}

/**
 * A map value, or the refusal of a site where the map is blank (NaN). The P.836-6 and P.840-8
 * maps are blank along 88.875° N; nothing must leave here as NaN.
 *
 * @example
 * mapValueOrRefuse(2.09, entry, { latDeg: 51.5, lonDeg: -0.14 }) // => 2.09
 */
export function mapValueOrRefuse(value: number, entry: MapEntry, site: SiteCoordinates): number {
  if (Number.isFinite(value)) return value;
  throw new EngineInputError(
    'site.latDeg',
    `no ITU-R map data at this site (latitude ${site.latDeg}°, longitude ${site.lonDeg}°: the ${entry.recommendation} map of ${entry.quantity} is blank there); geostationary satellites are not visible there anyway`,
    site.latDeg,
  );
}
