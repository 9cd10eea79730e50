'use server';

import { revalidatePath } from 'next/cache';
import { UniqueConstraintError } from 'sequelize';
import { safeAction } from './safe-action';
import { dishIdSchema, dishSchema, dishUpdateSchema } from '@/server/validation/dish';
import * as dishes from '@/db/queries/dishes';
import { InvalidInputError, NotFoundError } from '@/server/errors';

function nameTaken(error: unknown, name: string): never {
  if (error instanceof UniqueConstraintError) {
    throw new InvalidInputError(`A dish named "${name}" is already in the catalogue.`, { name: ['That name is already in the catalogue.'] });
  }
  throw error;
}

export const createDish = safeAction({ schema: dishSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  const row = await dishes.createDish(ctx.companyId, input).catch((e) => nameTaken(e, input.name));
  revalidatePath('/dishes');
  return { data: { id: row.id }, message: `${row.name} added to the catalogue.` };
});

export const updateDish = safeAction({ schema: dishUpdateSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  const found = await dishes.updateDish(ctx.companyId, input.id, input).catch((e) => nameTaken(e, input.name));
  if (!found) throw new NotFoundError('That dish');
  revalidatePath('/dishes');
  return { data: { id: input.id }, message: `${input.name} saved. Studies and quotes made earlier keep the prices they were made with.` };
});

export const deleteDish = safeAction({ schema: dishIdSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  if (!(await dishes.deleteDish(ctx.companyId, input.id))) throw new NotFoundError('That dish');
  revalidatePath('/dishes');
  return { message: 'Dish removed from the catalogue. Studies made with it keep their own copy.' };
});
