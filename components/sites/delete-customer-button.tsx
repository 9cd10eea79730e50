'use client';

import { deleteCustomer } from '@/server/actions/customers';
import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { AfterSave } from './after-save';

/** Deletes a customer after a confirmation; the server refuses while sites still belong to it (the reason shows here). */
export function DeleteCustomerButton({ customer, onDeleted }: { customer: { id: number; name: string; siteCount: number }; onDeleted?: () => void }) {
  return (
    <ActionForm
      action={deleteCustomer}
      confirm={`Delete the customer ${customer.name}? Studies and quotes made for them keep their own copy of the name.`}
      showSuccess={false}
      className="flex flex-wrap items-center gap-2"
    >
      <AfterSave listPrefix="/api/v1/customers" onSaved={onDeleted} />
      <input type="hidden" name="id" value={customer.id} />
      <SubmitButton variant="danger" size="sm" pendingLabel="Deleting…" aria-label={`Delete ${customer.name}`}>
        Delete customer
      </SubmitButton>
      {customer.siteCount > 0 && <span className="text-xs text-stone-600">Only a customer without sites can be deleted.</span>}
    </ActionForm>
  );
}
