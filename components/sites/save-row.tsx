'use client';

import type { ActionState } from '@/server/actions/safe-action';
import { Button } from '@/components/ui/button';
import { FormStatus } from '@/components/ui/form-status';

/** The submit, cancel and status line under an add-or-edit form of a list row. */
export function SaveRow({ pending, label, onCancel, state, failed, message }: {
  pending: boolean;
  label: string;
  onCancel?: () => void;
  state: ActionState | null;
  failed: boolean;
  message: string;
}) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button type="submit" disabled={pending}>
        {pending ? 'Saving…' : label}
      </Button>
      {onCancel && (
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      )}
      <FormStatus state={failed ? { ok: false, error: message } : state} />
    </div>
  );
}
