'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { customerCreateSchema, customerIdSchema, customerUpdateSchema } from '@/server/validation/customer';
import { addCustomer } from '@/server/customers/add-customer';
import * as customers from '@/db/queries/customers';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { models } from '@/db/models';
import { ConflictError, NotFoundError } from '@/server/errors';

/** A new customer: refused when one of the same name exists, unless the form says it is another one (addCustomer). */
export const createCustomer = safeAction({ schema: customerCreateSchema, permission: 'customer.write' }, async (input, ctx) => {
  const row = await models().sequelize.transaction(async (t) => addCustomer(await lockCompanyRow(ctx.companyId, t), input));
  revalidatePath('/customers');
  return { data: { id: row.id }, message: `Customer ${row.name} added.` };
});

export const updateCustomer = safeAction({ schema: customerUpdateSchema, permission: 'customer.write' }, async (input, ctx) => {
  if (!(await customers.updateCustomer(ctx.companyId, input.id, input))) throw new NotFoundError('That customer');
  revalidatePath('/customers');
  return { data: { id: input.id }, message: `Customer ${input.name} saved.` };
});

export const deleteCustomer = safeAction({ schema: customerIdSchema, permission: 'customer.write' }, async (input, ctx) => {
  const outcome = await customers.deleteCustomer(ctx.companyId, input.id);
  if (outcome === 'missing') throw new NotFoundError('That customer');
  if (outcome === 'has-sites') throw new ConflictError('This customer still has sites. Move or delete the sites first.');
  revalidatePath('/customers');
  return { message: 'Customer deleted.' };
});
