'use client';

import { useActionState } from 'react';
import { deleteCustomer } from '@/server/actions/customers';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';
import { useAfterSave } from './use-after-save';

/** Deletes a customer after a confirmation; the server refuses while sites still belong to it (the reason shows here). */
export function DeleteCustomerButton({ customer, onDeleted }: { customer: { id: number; name: string; siteCount: number }; onDeleted?: () => void }) {
  const [state, action] = useActionState(deleteCustomer, null);
  useAfterSave(state, '/api/v1/customers', onDeleted);
  return (
    <form
      action={action}
      onSubmit={(e) => {
        if (!window.confirm(`Delete the customer ${customer.name}? Studies and quotes made for them keep their own copy of the name.`)) e.preventDefault();
      }}
      className="flex flex-wrap items-center gap-2"
    >
      <input type="hidden" name="id" value={customer.id} />
      <SubmitButton variant="danger" size="sm" pendingLabel="Deleting…" aria-label={`Delete ${customer.name}`}>
        Delete customer
      </SubmitButton>
      {customer.siteCount > 0 && <span className="text-xs text-stone-600">Only a customer without sites can be deleted.</span>}
      {state && !state.ok && <FormStatus state={state} />}
    </form>
  );
}
