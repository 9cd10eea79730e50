'use client';

import { useActionState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { openPortalAction } from '@/server/actions/billing';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';

/** Opens the provider's billing portal (payment method, invoices, plan change, cancellation). */
export function PortalButton({ label = 'Manage payment, invoices or cancel' }: { label?: string }) {
  const [state, formAction] = useActionState<ActionState | null, FormData>(openPortalAction, null);
  return (
    <form action={formAction} className="flex flex-col items-start gap-1">
      <SubmitButton variant="secondary" pendingLabel="Opening…">{label}</SubmitButton>
      <FormStatus state={state} showSuccess={false} />
    </form>
  );
}
