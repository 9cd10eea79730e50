'use client';

import { useActionState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { syncPlanAction } from '@/server/actions/plans';
import { SubmitButton } from '@/components/ui/submit-button';

export function SyncPlanButton({ planId }: { planId: number }) {
  const [state, formAction] = useActionState<ActionState<{ planId: number }> | null, FormData>(syncPlanAction, null);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="id" value={planId} />
      <SubmitButton variant="secondary" size="sm" pendingLabel="Syncing…">Sync to provider</SubmitButton>
      {state && <p aria-live="polite" className={`max-w-56 text-right text-xs ${state.ok ? 'text-ledger-800' : 'text-red-700'}`}>{state.ok ? 'Synced.' : state.error}</p>}
    </form>
  );
}
