import 'server-only';
import type { CompanyLock } from '@/db/queries/company-lock';
import * as customers from '@/db/queries/customers';
import { InvalidInputError } from '@/server/errors';
import { DUPLICATE_CUSTOMER, type CustomerInput } from '@/server/validation/customer';

class DuplicateCustomerError extends InvalidInputError {
  override readonly code = DUPLICATE_CUSTOMER;
}

const addedOn = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/**
 * The one way a new customer is added, from the Customers form or typed into the study form. The
 * same name twice (case and spacing aside, customerNameKey) is usually the same customer entered
 * twice, so it is refused with the existing one named, unless the form says it is a different
 * customer with the same name (`sameNameOk`). It takes the company row lock, so the check and the
 * insert cannot interleave with another submit: two quick ones cannot both pass the check.
 *
 * `field` is the form field the refusal is shown on ('name' on the Customers form,
 * 'newCustomerName' on the study form).
 */
export async function addCustomer(lock: CompanyLock, input: CustomerInput & { sameNameOk: boolean }, field = 'name') {
  const { companyId, transaction: t } = lock;
  if (!input.sameNameOk) {
    const same = await customers.findCustomerByName(companyId, input.name, t);
    if (same) {
      const about = [same.email, `${same.siteCount} site${same.siteCount === 1 ? '' : 's'}`, `added ${addedOn(same.createdAt)}`].filter(Boolean).join(', ');
      throw new DuplicateCustomerError(`${same.name} is already one of your customers (${about}). Use that customer, or tick “A different customer with the same name” to add another.`, {
        [field]: [`${same.name} is already a customer (${about}).`],
      });
    }
  }
  return customers.createCustomer(companyId, input, t);
}
