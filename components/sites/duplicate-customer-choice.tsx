'use client';

import { useFormState } from '@/components/ui/action-form';
import { Notice } from '@/components/ui/notice';
import { DUPLICATE_CUSTOMER } from '@/server/validation/customer';

/**
 * Inside a form that adds a customer (the Customers form, the study form's new customer): once the
 * server says a customer of that name exists (addCustomer), name it and offer the way on — use that
 * customer (`useExisting` says how on this form), or confirm this is another customer with the same
 * name and submit again.
 */
export function DuplicateCustomerChoice({ useExisting = 'To use the existing customer, search for the name in the list above and add the site or study to it.' }: { useExisting?: string } = {}) {
  const state = useFormState();
  if (!state || state.ok || state.code !== DUPLICATE_CUSTOMER) return null;
  return (
    <Notice tone="caution" title="This customer may already exist">
      <p>{state.error}</p>
      <p className="mt-1">{useExisting}</p>
      <label className="mt-2 flex items-center gap-2 font-medium">
        <input type="checkbox" name="sameNameOk" className="h-4 w-4 rounded border-stone-400 text-ledger-700" />A different customer with the same name
      </label>
    </Notice>
  );
}
