'use client';

import { createContext, useActionState, useContext, useEffect, useRef, type ReactNode } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { FormStatus } from './form-status';

type FormAction = (prev: ActionState<never> | null, formData: FormData) => Promise<ActionState<unknown>>;

const FormStateContext = createContext<ActionState<unknown> | null>(null);

/** The last answer of the surrounding ActionForm's action (fields read their errors from it). */
export function useFormState(): ActionState<unknown> | null {
  return useContext(FormStateContext);
}

/**
 * A form bound to a server action through useActionState, with an aria-live status line.
 * Fields inside read their error messages and refill values from the action's answer.
 * Works without JavaScript too (progressive enhancement: the action is the form's action).
 */
export function ActionForm({
  action,
  children,
  className = '',
  statusClassName = '',
  showSuccess = true,
  resetOnSuccess = false,
  'aria-label': ariaLabel,
  id,
}: {
  action: FormAction;
  children: ReactNode;
  className?: string;
  statusClassName?: string;
  showSuccess?: boolean;
  resetOnSuccess?: boolean;
  'aria-label'?: string;
  id?: string;
}) {
  const [state, formAction] = useActionState(action as (prev: ActionState<unknown> | null, formData: FormData) => Promise<ActionState<unknown>>, null);
  const ref = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok && resetOnSuccess) ref.current?.reset();
  }, [state, resetOnSuccess]);
  return (
    <FormStateContext.Provider value={state}>
      <form ref={ref} action={formAction} className={className} aria-label={ariaLabel} id={id} noValidate>
        {children}
        <FormStatus state={state} showSuccess={showSuccess} className={statusClassName} />
      </form>
    </FormStateContext.Provider>
  );
}
