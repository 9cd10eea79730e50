'use client';

import { createCustomer, updateCustomer } from '@/server/actions/customers';
import { customerSchema, customerUpdateSchema } from '@/server/validation/customer';
import { TextArea, TextInput } from '@/components/study/form-fields';
import { useValidatedAction } from '@/components/study/use-validated-action';
import { useAfterSave } from './use-after-save';
import { SaveRow } from './save-row';

export type CustomerFormValues = { id: number; name: string; email: string | null; phone: string | null; notes: string | null };

/** Add a customer, or (with `customer`) change one; `onSaved` runs once the server accepted it. */
export function CustomerForm({ customer, onSaved, onCancel }: { customer?: CustomerFormValues; onSaved?: () => void; onCancel?: () => void } = {}) {
  const { state, formAction, pending, onSubmit, onInput, errors, message, failed } = useValidatedAction(customer ? updateCustomer : createCustomer, customer ? customerUpdateSchema : customerSchema, {
    resetOnSuccess: !customer,
  });
  useAfterSave(state, '/api/v1/customers', onSaved);
  return (
    <form action={formAction} onSubmit={onSubmit} onInput={onInput} noValidate className="space-y-4" aria-label={customer ? `Edit ${customer.name}` : 'Add a customer'}>
      {customer && <input type="hidden" name="id" value={customer.id} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextInput label="Name" name="name" defaultValue={customer?.name} errors={errors.name} />
        <TextInput label="E-mail (optional)" name="email" type="email" defaultValue={customer?.email ?? ''} errors={errors.email} />
        <TextInput label="Phone (optional)" name="phone" defaultValue={customer?.phone ?? ''} errors={errors.phone} />
        {customer && <TextArea label="Notes (optional)" name="notes" defaultValue={customer.notes ?? ''} errors={errors.notes} className="sm:col-span-3" />}
      </div>
      <SaveRow pending={pending} label={customer ? 'Save customer' : 'Add customer'} onCancel={onCancel} state={state} failed={failed} message={message} />
    </form>
  );
}
