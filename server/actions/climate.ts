'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { climateFormSchema, climateProfileIdSchema } from '@/server/validation/climate';
import * as climate from '@/db/queries/climate-profiles';
import { NotFoundError } from '@/server/errors';

/** Known R0.01 or a P.837-1 zone typed in; monthly normals and measured curves come through uploads. */
export const createClimateProfile = safeAction({ schema: climateFormSchema, permission: 'climate.write' }, async (input, ctx) => {
  const row = await climate.createClimateProfile(ctx.companyId, input);
  revalidatePath('/climate');
  return { data: { id: row.id }, message: `Climate profile ${row.name} added.` };
});

export const deleteClimateProfile = safeAction({ schema: climateProfileIdSchema, permission: 'climate.write' }, async (input, ctx) => {
  if (!(await climate.deleteClimateProfile(ctx.companyId, input.id))) throw new NotFoundError('That climate profile');
  revalidatePath('/climate');
  return { message: 'Climate profile deleted. Studies made with it keep their own copy.' };
});
