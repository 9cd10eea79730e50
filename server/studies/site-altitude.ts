import type { AltitudeSource } from '@/db/models/site';
import { isEngineInputError } from '@/server/engine/errors';
import { InvalidInputError } from '@/server/errors';
import { SITE_ALTITUDE_M } from '@/server/validation/site';
import { mapsAltitudeM } from './maps-climate';

/**
 * A site's station altitude: the one the user typed in, else the ITU-R P.1511-1 topographic
 * height at its coordinates (server/engine/README.md §7), with where it came from so every screen can say so.
 * Where the map has nothing, or gives a height outside the range a site may have, the user is
 * asked to type it in (422 on `altitudeM`), never given a guess.
 *
 * @example resolveSiteAltitude(46.5, 3.25, undefined) // => { altitudeM: 287, altitudeSource: 'itu-r-p1511-1' }
 * @example resolveSiteAltitude(46.5, 3.25, 220)       // => { altitudeM: 220, altitudeSource: 'user' }
 */
export function resolveSiteAltitude(latDeg: number, lonDeg: number, altitudeM: number | undefined): { altitudeM: number; altitudeSource: AltitudeSource } {
  if (altitudeM !== undefined) return { altitudeM, altitudeSource: 'user' };
  let fromMap: number;
  try {
    fromMap = mapsAltitudeM(latDeg, lonDeg);
  } catch (e) {
    if (!isEngineInputError(e)) throw e;
    const message = 'The ITU-R P.1511-1 map has no ground height at these coordinates: enter the altitude.';
    throw new InvalidInputError(message, { altitudeM: [message] });
  }
  if (fromMap < SITE_ALTITUDE_M.min || fromMap > SITE_ALTITUDE_M.max) {
    const message = `The ITU-R P.1511-1 map gives ${fromMap} m here, outside ${SITE_ALTITUDE_M.min}…${SITE_ALTITUDE_M.max} m: enter the altitude of the dish.`;
    throw new InvalidInputError(message, { altitudeM: [message] });
  }
  // -0 reads oddly on screen and in the database.
  return { altitudeM: fromMap === 0 ? 0 : fromMap, altitudeSource: 'itu-r-p1511-1' };
}
