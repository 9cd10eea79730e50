'use client';

import { useActionState } from 'react';
import { useFormStatus } from 'react-dom';
import type { ActionState } from '@/server/actions/safe-action';
import { syncPlanAction } from '@/server/actions/plans';

function Submit() {
  const { pending } = useFormStatus();
  return (
    <button type="submit" disabled={pending} className="rounded border border-stone-300 bg-white px-2 py-1 text-xs font-medium text-stone-800 hover:border-ledger-600 disabled:opacity-60">
      {pending ? 'Syncing…' : 'Sync to provider'}
    </button>
  );
}

export function SyncPlanButton({ planId }: { planId: number }) {
  const [state, formAction] = useActionState<ActionState<{ planId: number }> | null, FormData>(syncPlanAction, null);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="id" value={planId} />
      <Submit />
      {state && <p aria-live="polite" className={`max-w-56 text-right text-xs ${state.ok ? 'text-ledger-800' : 'text-red-700'}`}>{state.ok ? 'Synced.' : state.error}</p>}
    </form>
  );
}
