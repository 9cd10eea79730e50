'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';

/** A destructive submit that asks once more in place ("Remove Ana?" → Yes / Keep). */
export function ConfirmSubmit({ label, question, confirmLabel, ariaLabel }: { label: ReactNode; question: ReactNode; confirmLabel: string; ariaLabel?: string }) {
  const [asking, setAsking] = useState(false);
  // The pressed button unmounts when the question appears (and again on "Keep"): move the focus to the
  // first button now shown, so a keyboard or screen-reader user is not dropped at the top of the page.
  const box = useRef<HTMLSpanElement>(null);
  const pressed = useRef(false);
  useEffect(() => {
    if (pressed.current) box.current?.querySelector('button')?.focus();
  }, [asking]);
  const ask = (value: boolean) => {
    pressed.current = true;
    setAsking(value);
  };
  if (!asking) {
    return (
      <span ref={box} className="contents">
        <Button variant="quiet" size="sm" onClick={() => ask(true)} aria-label={ariaLabel}>
          {label}
        </Button>
      </span>
    );
  }
  return (
    <span ref={box} className="inline-flex flex-wrap items-center gap-1.5">
      <span className="text-sm text-stone-700">{question}</span>
      <SubmitButton variant="danger" size="sm">
        {confirmLabel}
      </SubmitButton>
      <Button variant="quiet" size="sm" onClick={() => ask(false)}>
        Keep
      </Button>
    </span>
  );
}
