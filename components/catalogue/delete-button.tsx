'use client';

import type { ActionState } from '@/server/actions/safe-action';
import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';

type Act = (prev: ActionState<never> | null, input: FormData) => Promise<ActionState<unknown>>;

/** A small confirm-then-delete form for a row (studies keep their own copies, so deleting is safe for them). */
export function DeleteRowButton({ action, id, label, confirmText }: { action: Act; id: number; label: string; confirmText: string }) {
  return (
    <ActionForm action={action} confirm={confirmText} showSuccess={false} className="inline-flex items-center gap-2">
      <input type="hidden" name="id" value={id} />
      <SubmitButton variant="danger" size="sm" aria-label={label}>
        Delete
      </SubmitButton>
    </ActionForm>
  );
}
