'use client';

import { useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';

/** A destructive submit that asks once more in place ("Remove Ana?" → Yes / Keep). */
export function ConfirmSubmit({ label, question, confirmLabel, ariaLabel }: { label: ReactNode; question: ReactNode; confirmLabel: string; ariaLabel?: string }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button variant="quiet" size="sm" onClick={() => setAsking(true)} aria-label={ariaLabel}>
        {label}
      </Button>
    );
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5">
      <span className="text-sm text-stone-700">{question}</span>
      <SubmitButton variant="danger" size="sm">
        {confirmLabel}
      </SubmitButton>
      <Button variant="quiet" size="sm" onClick={() => setAsking(false)}>
        Keep
      </Button>
    </span>
  );
}
