'use client';

import { useActionState } from 'react';
import { useFormStatus } from 'react-dom';
import type { ActionState } from '@/server/actions/safe-action';
import { openPortalAction } from '@/server/actions/billing';

function Submit({ label }: { label: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" disabled={pending} className="rounded border border-stone-300 bg-white px-3 py-2 text-sm font-medium text-stone-800 hover:border-ledger-600 hover:text-ledger-800 disabled:opacity-60">
      {pending ? 'Opening…' : label}
    </button>
  );
}

/** Opens the provider's billing portal (payment method, invoices, plan change, cancellation). */
export function PortalButton({ label = 'Manage payment, invoices or cancel' }: { label?: string }) {
  const [state, formAction] = useActionState<ActionState | null, FormData>(openPortalAction, null);
  return (
    <form action={formAction} className="flex flex-col items-start gap-1">
      <Submit label={label} />
      <p aria-live="polite" className="text-sm text-red-700">{state && !state.ok ? state.error : ''}</p>
    </form>
  );
}
