import type { ClimateSnapshot, SiteSnapshot } from './snapshot';

/** Mean Earth radius R1 of the IUGG, km: enough for a distance stated to the kilometre. */
const MEAN_EARTH_RADIUS_KM = 6371.0088;
/** Beyond this distance an override profile is said to be made for somewhere else. */
export const PROFILE_FAR_FROM_SITE_KM = 100;
const DEG = Math.PI / 180;

/**
 * Great-circle distance between two points on a spherical Earth (haversine), km.
 *
 * @example greatCircleKm({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 1 }) // => 111.195
 */
export function greatCircleKm(a: { latDeg: number; lonDeg: number }, b: { latDeg: number; lonDeg: number }): number {
  const dLat = (b.latDeg - a.latDeg) * DEG;
  const dLon = (b.lonDeg - a.lonDeg) * DEG;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.latDeg * DEG) * Math.cos(b.latDeg * DEG) * Math.sin(dLon / 2) ** 2;
  return 2 * MEAN_EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** How an override profile's place relates to the site; null for the maps (read at the site) and for older studies. */
export type ClimatePlace =
  | { kind: 'near'; distanceKm: number }
  | { kind: 'far'; distanceKm: number }
  | { kind: 'unknown' };

/**
 * Where the study's rain-climate profile was made for, against the site. Studies made before
 * profiles recorded a place (no `location` key) say nothing rather than a warning they never had.
 *
 * @example climatePlaceOf({ latDeg: 48.6, lonDeg: -21.8 }, { kind: 'known-r001', location: null }) // => { kind: 'unknown' }
 */
export function climatePlaceOf(site: Pick<SiteSnapshot, 'latDeg' | 'lonDeg'>, climate: Pick<ClimateSnapshot, 'kind' | 'location'>): ClimatePlace | null {
  if (climate.kind === 'itu-r-maps' || climate.location === undefined) return null;
  if (climate.location === null) return { kind: 'unknown' };
  const distanceKm = greatCircleKm(site, climate.location);
  return { kind: distanceKm > PROFILE_FAR_FROM_SITE_KM ? 'far' : 'near', distanceKm };
}

/** The warning the study shows for a profile made somewhere else or for no known place; null when it fits. */
export function climatePlaceWarning(profileName: string, place: ClimatePlace | null): string | null {
  if (!place || place.kind === 'near') return null;
  if (place.kind === 'unknown') {
    return `The rain climate profile “${profileName}” was made for an unknown place (no location is stored with it). Check that its figures belong to this site, or use the ITU-R maps at the site.`;
  }
  return `The rain climate profile “${profileName}” was made for a place ${Math.round(place.distanceKm).toLocaleString('en-US')} km from this site (more than ${PROFILE_FAR_FROM_SITE_KM} km). Its rain figures may not describe this site; the ITU-R maps at the site may fit better.`;
}
