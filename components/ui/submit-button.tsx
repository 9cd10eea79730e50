'use client';

import { useFormStatus } from 'react-dom';
import type { ReactNode } from 'react';
import { buttonClasses, type ButtonSize, type ButtonVariant } from './button';
import { useFormPending } from './action-form';

/**
 * A submit button that shows it is working while its form's action runs: React's form status for
 * forms sent through their action, the ActionForm's own for forms checked in the browser first.
 */
export function SubmitButton({
  children,
  pendingLabel,
  variant = 'primary',
  size = 'md',
  className = '',
  name,
  value,
  disabled = false,
  'aria-label': ariaLabel,
}: {
  children: ReactNode;
  pendingLabel?: ReactNode;
  variant?: ButtonVariant;
  size?: ButtonSize;
  className?: string;
  name?: string;
  value?: string;
  /** Held back for a reason of the form's own (e.g. a file over the size limit). */
  disabled?: boolean;
  'aria-label'?: string;
}) {
  const sending = useFormStatus().pending;
  const running = useFormPending();
  const pending = sending || running;
  return (
    <button type="submit" disabled={pending || disabled} aria-disabled={pending || disabled} name={name} value={value} aria-label={ariaLabel} className={buttonClasses(variant, size, className)}>
      {pending && (
        <svg className="h-3.5 w-3.5 animate-spin" viewBox="0 0 24 24" aria-hidden="true">
          <circle cx="12" cy="12" r="9" fill="none" stroke="currentColor" strokeOpacity="0.3" strokeWidth="3" />
          <path d="M21 12a9 9 0 0 0-9-9" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
        </svg>
      )}
      {pending && pendingLabel ? pendingLabel : children}
    </button>
  );
}
