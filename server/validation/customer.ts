import { z } from 'zod';
import { idField, optionalEmail, optionalText, requiredText } from './fields';

/** A customer of the company (the form on the customers page and the new-study form). */
export const customerSchema = z.object({
  name: requiredText('Name', 160),
  email: optionalEmail(),
  phone: optionalText('Phone', 40),
  notes: optionalText('Notes', 2000),
});
export type CustomerInput = z.infer<typeof customerSchema>;

export const customerUpdateSchema = customerSchema.extend({ id: idField('customer') });
export const customerIdSchema = z.object({ id: idField('customer') });
