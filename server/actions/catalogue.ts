'use server';

import { revalidatePath } from 'next/cache';
import { UniqueConstraintError } from 'sequelize';
import { safeAction } from './safe-action';
import { dishIdSchema, dishSchema, dishUpdateSchema } from '@/server/validation/dish';
import * as dishes from '@/db/queries/dishes';
import { models } from '@/db/models';
import { InvalidInputError, NotFoundError } from '@/server/errors';
import { actorOf, recordAudit } from '@/server/audit/record';
import { priceChanges } from '@/server/audit/price-changes';

function nameTaken(error: unknown, name: string): never {
  if (error instanceof UniqueConstraintError) {
    throw new InvalidInputError(`A dish named "${name}" is already in the catalogue.`, { name: ['That name is already in the catalogue.'] });
  }
  throw error;
}

// Each change and its audit row commit together (a refused name leaves neither).
export const createDish = safeAction({ schema: dishSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  const row = await models()
    .sequelize.transaction(async (t) => {
      const created = await dishes.createDish(ctx.companyId, input, t);
      await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: 'catalogue.dish_created', target: created.name, detail: { dishId: created.id, hardwarePrice: created.hardwarePrice, labourPrice: created.labourPrice } }, t);
      return created;
    })
    .catch((e) => nameTaken(e, input.name));
  revalidatePath('/dishes');
  return { data: { id: row.id }, message: `${row.name} added to the catalogue.` };
});

export const updateDish = safeAction({ schema: dishUpdateSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  const found = await models()
    .sequelize.transaction(async (t) => {
      const [before] = await dishes.getDishesByIds(ctx.companyId, [input.id], t);
      if (!before) return false;
      const was = { name: before.name, hardwarePrice: before.hardwarePrice, labourPrice: before.labourPrice };
      if (!(await dishes.updateDish(ctx.companyId, input.id, input, t))) return false;
      const [after] = await dishes.getDishesByIds(ctx.companyId, [input.id], t);
      await recordAudit(
        { companyId: ctx.companyId, actor: actorOf(ctx) },
        { action: 'catalogue.dish_updated', target: after.name, detail: { dishId: input.id, ...priceChanges(was, { name: after.name, hardwarePrice: after.hardwarePrice, labourPrice: after.labourPrice }) } },
        t,
      );
      return true;
    })
    .catch((e) => nameTaken(e, input.name));
  if (!found) throw new NotFoundError('That dish');
  revalidatePath('/dishes');
  return { data: { id: input.id }, message: `${input.name} saved. Studies and quotes made earlier keep the prices they were made with.` };
});

export const deleteDish = safeAction({ schema: dishIdSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  const removed = await models().sequelize.transaction(async (t) => {
    const [before] = await dishes.getDishesByIds(ctx.companyId, [input.id], t);
    if (!before || !(await dishes.deleteDish(ctx.companyId, input.id, t))) return false;
    await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: 'catalogue.dish_deleted', target: before.name, detail: { dishId: input.id } }, t);
    return true;
  });
  if (!removed) throw new NotFoundError('That dish');
  revalidatePath('/dishes');
  return { message: 'Dish removed from the catalogue. Studies made with it keep their own copy.' };
});
