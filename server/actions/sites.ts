'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { siteSchema, siteUpdateSchema } from '@/server/validation/site';
import { getCustomer } from '@/db/queries/customers';
import * as sites from '@/db/queries/sites';
import { NotFoundError } from '@/server/errors';
import { formatDms } from '@/server/validation/coordinates';
import { resolveSiteAltitude } from '@/server/studies/site-altitude';

/** " at 212 m (ITU-R P.1511-1 map)" when the altitude was left blank, so the user sees what was filled in. */
function altitudeNote(a: ReturnType<typeof resolveSiteAltitude>): string {
  return a.altitudeSource === 'user' ? '' : ` Altitude ${a.altitudeM} m from the ITU-R P.1511-1 map (the box was blank).`;
}

export const createSite = safeAction({ schema: siteSchema, permission: 'customer.write' }, async (input, ctx) => {
  if (!(await getCustomer(ctx.companyId, input.customerId))) throw new NotFoundError('That customer');
  const altitude = resolveSiteAltitude(input.latDeg, input.lonDeg, input.altitudeM);
  const row = await sites.createSite(ctx.companyId, input.customerId, { ...input, ...altitude });
  revalidatePath('/sites');
  return {
    data: { id: row.id },
    message: `Site ${row.name} added at ${formatDms(input.latDeg, 'lat')}, ${formatDms(input.lonDeg, 'lon')}.${altitudeNote(altitude)}`,
  };
});

export const updateSite = safeAction({ schema: siteUpdateSchema, permission: 'customer.write' }, async (input, ctx) => {
  if (!(await getCustomer(ctx.companyId, input.customerId))) throw new NotFoundError('That customer');
  // A blank altitude is taken from the map again at the (possibly new) coordinates.
  const altitude = resolveSiteAltitude(input.latDeg, input.lonDeg, input.altitudeM);
  if (!(await sites.updateSite(ctx.companyId, input.id, input.customerId, { ...input, ...altitude }))) throw new NotFoundError('That site');
  revalidatePath('/sites');
  return { data: { id: input.id }, message: `Site ${input.name} saved.${altitudeNote(altitude)} Studies made earlier keep the coordinates they were computed with.` };
});
