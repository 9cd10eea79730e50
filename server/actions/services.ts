'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { serviceProfileIdSchema, serviceProfileSchema, serviceProfileUpdateSchema } from '@/server/validation/service-profile';
import * as services from '@/db/queries/service-profiles';
import { models } from '@/db/models';
import { NotFoundError } from '@/server/errors';
import { actorOf, recordAudit } from '@/server/audit/record';

// Each change and its audit row commit together.
export const createServiceProfile = safeAction({ schema: serviceProfileSchema, permission: 'service.write' }, async (input, ctx) => {
  const row = await models().sequelize.transaction(async (t) => {
    const created = await services.createServiceProfile(ctx.companyId, input, t);
    await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: 'service.created', target: created.name, detail: { serviceProfileId: created.id } }, t);
    return created;
  });
  revalidatePath('/services');
  return { data: { id: row.id }, message: `Service ${row.name} added.` };
});

export const updateServiceProfile = safeAction({ schema: serviceProfileUpdateSchema, permission: 'service.write' }, async (input, ctx) => {
  const found = await models().sequelize.transaction(async (t) => {
    if (!(await services.updateServiceProfile(ctx.companyId, input.id, input, t))) return false;
    await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: 'service.updated', target: input.name, detail: { serviceProfileId: input.id } }, t);
    return true;
  });
  if (!found) throw new NotFoundError('That service profile');
  revalidatePath('/services');
  return { data: { id: input.id }, message: `Service ${input.name} saved. Studies made earlier keep the figures they were computed with.` };
});

export const deleteServiceProfile = safeAction({ schema: serviceProfileIdSchema, permission: 'service.write' }, async (input, ctx) => {
  const removed = await models().sequelize.transaction(async (t) => {
    const before = await services.getServiceProfile(ctx.companyId, input.id, t);
    if (!before || !(await services.deleteServiceProfile(ctx.companyId, input.id, t))) return false;
    await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: 'service.deleted', target: before.name, detail: { serviceProfileId: input.id } }, t);
    return true;
  });
  if (!removed) throw new NotFoundError('That service profile');
  revalidatePath('/services');
  return { message: 'Service profile deleted. Studies made with it keep their own copy.' };
});
