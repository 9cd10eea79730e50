'use client';

import { createCustomer, updateCustomer } from '@/server/actions/customers';
import { customerCreateSchema, customerUpdateSchema } from '@/server/validation/customer';
import { ActionForm } from '@/components/ui/action-form';
import { Field, TextAreaField } from '@/components/ui/field';
import { AfterSave } from './after-save';
import { SaveRow } from './save-row';
import { DuplicateCustomerChoice } from './duplicate-customer-choice';

export type CustomerFormValues = { id: number; name: string; email: string | null; phone: string | null; notes: string | null };

/** Add a customer, or (with `customer`) change one; `onSaved` runs once the server accepted it. */
export function CustomerForm({ customer, onSaved, onCancel }: { customer?: CustomerFormValues; onSaved?: () => void; onCancel?: () => void } = {}) {
  return (
    <ActionForm action={customer ? updateCustomer : createCustomer} schema={customer ? customerUpdateSchema : customerCreateSchema} resetOnSuccess={!customer} status="placed" className="space-y-4" aria-label={customer ? `Edit ${customer.name}` : 'Add a customer'}>
      <AfterSave listPrefix="/api/v1/customers" onSaved={onSaved} />
      {customer && <input type="hidden" name="id" value={customer.id} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Name" name="name" defaultValue={customer?.name} />
        <Field label="E-mail (optional)" name="email" type="email" defaultValue={customer?.email ?? ''} />
        <Field label="Phone (optional)" name="phone" defaultValue={customer?.phone ?? ''} />
        {customer && <TextAreaField label="Notes (optional)" name="notes" defaultValue={customer.notes ?? ''} className="sm:col-span-3" />}
      </div>
      {!customer && <DuplicateCustomerChoice />}
      <SaveRow label={customer ? 'Save customer' : 'Add customer'} onCancel={onCancel} />
    </ActionForm>
  );
}
