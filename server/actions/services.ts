'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { serviceProfileIdSchema, serviceProfileSchema, serviceProfileUpdateSchema } from '@/server/validation/service-profile';
import * as services from '@/db/queries/service-profiles';
import { NotFoundError } from '@/server/errors';

export const createServiceProfile = safeAction({ schema: serviceProfileSchema, permission: 'service.write' }, async (input, ctx) => {
  const row = await services.createServiceProfile(ctx.companyId, input);
  revalidatePath('/services');
  return { data: { id: row.id }, message: `Service ${row.name} added.` };
});

export const updateServiceProfile = safeAction({ schema: serviceProfileUpdateSchema, permission: 'service.write' }, async (input, ctx) => {
  if (!(await services.updateServiceProfile(ctx.companyId, input.id, input))) throw new NotFoundError('That service profile');
  revalidatePath('/services');
  return { data: { id: input.id }, message: `Service ${input.name} saved. Studies made earlier keep the figures they were computed with.` };
});

export const deleteServiceProfile = safeAction({ schema: serviceProfileIdSchema, permission: 'service.write' }, async (input, ctx) => {
  if (!(await services.deleteServiceProfile(ctx.companyId, input.id))) throw new NotFoundError('That service profile');
  revalidatePath('/services');
  return { message: 'Service profile deleted. Studies made with it keep their own copy.' };
});
