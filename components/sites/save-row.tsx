'use client';

import { ActionFormStatus } from '@/components/ui/action-form';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';

/** The submit, cancel and status line under an add-or-edit form of a list row (inside an ActionForm with status="placed"). */
export function SaveRow({ label, onCancel }: { label: string; onCancel?: () => void }) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <SubmitButton pendingLabel="Saving…">{label}</SubmitButton>
      {onCancel && (
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      )}
      <ActionFormStatus />
    </div>
  );
}
