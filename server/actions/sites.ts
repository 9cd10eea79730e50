'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { siteSchema, siteUpdateSchema } from '@/server/validation/site';
import { getCustomer } from '@/db/queries/customers';
import * as sites from '@/db/queries/sites';
import { NotFoundError } from '@/server/errors';
import { formatDms } from '@/server/validation/coordinates';

export const createSite = safeAction({ schema: siteSchema, permission: 'customer.write' }, async (input, ctx) => {
  if (!(await getCustomer(ctx.companyId, input.customerId))) throw new NotFoundError('That customer');
  const row = await sites.createSite(ctx.companyId, input.customerId, input);
  revalidatePath('/sites');
  return {
    data: { id: row.id },
    message: `Site ${row.name} added at ${formatDms(input.latDeg, 'lat')}, ${formatDms(input.lonDeg, 'lon')}.`,
  };
});

export const updateSite = safeAction({ schema: siteUpdateSchema, permission: 'customer.write' }, async (input, ctx) => {
  if (!(await getCustomer(ctx.companyId, input.customerId))) throw new NotFoundError('That customer');
  if (!(await sites.updateSite(ctx.companyId, input.id, input.customerId, input))) throw new NotFoundError('That site');
  revalidatePath('/sites');
  return { data: { id: input.id }, message: `Site ${input.name} saved. Studies made earlier keep the coordinates they were computed with.` };
});
