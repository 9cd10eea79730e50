import { z } from 'zod';
import { coordinateField, idField, optionalNumberIn, optionalText, requiredText } from './fields';

/** Site altitude above mean sea level, m: from the Dead Sea shore to high plateaus. */
export const SITE_ALTITUDE_M = { min: -450, max: 6000 } as const;

/**
 * Fields of a site; latitude and longitude accept decimal degrees or DMS (server/validation/coordinates.ts).
 * A blank altitude is `undefined`: the server fills it from the ITU-R P.1511-1 map (server/studies/site-altitude.ts).
 */
const siteFields = {
  name: requiredText('Site name', 160),
  address: optionalText('Address', 300),
  latDeg: coordinateField('lat'),
  lonDeg: coordinateField('lon'),
  altitudeM: optionalNumberIn('Altitude', SITE_ALTITUDE_M.min, SITE_ALTITUDE_M.max, 'm'),
  notes: optionalText('Notes', 2000),
};

export const siteSchema = z.object({ customerId: idField('customer'), ...siteFields });
export const siteUpdateSchema = siteSchema.extend({ id: idField('site') });
