'use client';

import { useActionState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';

type Act = (prev: ActionState<never> | null, input: FormData) => Promise<ActionState<unknown>>;

/** A small confirm-then-delete form for a row (studies keep their own copies, so deleting is safe for them). */
export function DeleteRowButton({ action, id, label, confirmText }: { action: Act; id: number; label: string; confirmText: string }) {
  const [state, formAction] = useActionState(action as unknown as (prev: ActionState<unknown> | null, input: FormData) => Promise<ActionState<unknown>>, null);
  return (
    <form
      action={formAction}
      onSubmit={(e) => {
        if (!window.confirm(confirmText)) e.preventDefault();
      }}
      className="inline-flex items-center gap-2"
    >
      <input type="hidden" name="id" value={id} />
      <SubmitButton variant="danger" size="sm" aria-label={label}>
        Delete
      </SubmitButton>
      {state && !state.ok && <FormStatus state={state} />}
    </form>
  );
}
