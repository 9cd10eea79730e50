'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { customerCreateSchema, customerIdSchema, customerUpdateSchema, DUPLICATE_CUSTOMER } from '@/server/validation/customer';
import * as customers from '@/db/queries/customers';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { models } from '@/db/models';
import { ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';

class DuplicateCustomerError extends InvalidInputError {
  override readonly code = DUPLICATE_CUSTOMER;
}

const addedOn = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/**
 * A new customer. The same name twice (case and spacing aside) is usually the same customer
 * entered twice, so it is refused with the existing one named, unless the form says it is a
 * different customer with the same name. The check and the insert hold the company row lock, so two
 * quick submits cannot both pass the check.
 */
export const createCustomer = safeAction({ schema: customerCreateSchema, permission: 'customer.write' }, async (input, ctx) => {
  const row = await models().sequelize.transaction(async (t) => {
    await lockCompanyRow(ctx.companyId, t);
    if (!input.sameNameOk) {
      const same = await customers.findCustomerByName(ctx.companyId, input.name, t);
      if (same) {
        const about = [same.email, `${same.siteCount} site${same.siteCount === 1 ? '' : 's'}`, `added ${addedOn(same.createdAt)}`].filter(Boolean).join(', ');
        throw new DuplicateCustomerError(`${same.name} is already one of your customers (${about}). Use that customer, or tick “A different customer with the same name” to add another.`, {
          name: [`${same.name} is already a customer (${about}).`],
        });
      }
    }
    return customers.createCustomer(ctx.companyId, input, t);
  });
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
