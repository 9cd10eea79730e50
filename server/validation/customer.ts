import { z } from 'zod';
import { checkboxField, idField, optionalEmail, optionalText, requiredText } from './fields';

/** A customer of the company (the form on the customers page and the new-study form). */
export const customerSchema = z.object({
  name: requiredText('Name', 160),
  email: optionalEmail(),
  phone: optionalText('Phone', 40),
  notes: optionalText('Notes', 2000),
});
export type CustomerInput = z.infer<typeof customerSchema>;

/** Code of the refusal of a second customer with the same name; the form then offers the existing one. */
export const DUPLICATE_CUSTOMER = 'duplicate_customer';

/** A new customer; `sameNameOk` says "a different customer who has the same name as one we have". */
export const customerCreateSchema = customerSchema.extend({ sameNameOk: checkboxField() });

export const customerUpdateSchema = customerSchema.extend({ id: idField('customer') });
export const customerIdSchema = z.object({ id: idField('customer') });
