'use client';

import { createContext, startTransition, useActionState, useContext, useEffect, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { z } from 'zod';
import type { ActionState } from '@/server/actions/safe-action';
import { fieldErrorsFrom } from '@/server/validation/fields';
import { FormStatus } from './form-status';

type FormAction = (prev: ActionState<never> | null, formData: FormData) => Promise<ActionState<unknown>>;

interface FormContextValue {
  /** The action's last answer, or the browser's refusal of the form before it was sent. */
  state: ActionState<unknown> | null;
  pending: boolean;
  /** Fields typed in since the last answer: their old message is hidden so the new value speaks for itself. */
  edited: ReadonlySet<string>;
}

const FormContext = createContext<FormContextValue>({ state: null, pending: false, edited: new Set() });

/** The last answer of the surrounding ActionForm's action (fields read their errors from it). */
export function useFormState(): ActionState<unknown> | null {
  return useContext(FormContext).state;
}

/** Whether the surrounding ActionForm's action is running. */
export function useFormPending(): boolean {
  return useContext(FormContext).pending;
}

/**
 * The messages for the named fields: those under each name and under any path inside it
 * ("dishIds.2"), except for fields edited since the answer came.
 */
export function useFieldErrors(...names: string[]): string[] {
  const { state, edited } = useContext(FormContext);
  if (!state || state.ok || !state.fieldErrors) return [];
  const shown = names.filter((n) => !edited.has(n));
  return Object.entries(state.fieldErrors).flatMap(([key, messages]) => (shown.some((n) => key === n || key.startsWith(`${n}.`)) ? messages : []));
}

/** A form that is not an ActionForm (two actions behind two buttons) lends its fields an answer to read. */
export function FormStateProvider({ state, children }: { state: ActionState<unknown> | null; children: ReactNode }) {
  return <FormContext.Provider value={{ state, pending: false, edited: new Set() }}>{children}</FormContext.Provider>;
}

/** FormData → plain object as the server's safeAction builds it (repeated names become arrays). */
function formObject(form: HTMLFormElement): Record<string, unknown> {
  const data = new FormData(form);
  const out: Record<string, unknown> = {};
  for (const key of new Set(data.keys())) {
    const all = data.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}

const CHECK_FIELDS = 'Please check the highlighted fields.';

/**
 * A form bound to a server action through useActionState, with an aria-live status line.
 * Fields inside read their error messages (and, after a refusal, the values typed) from it.
 *
 * With `schema` — the same zod schema the action uses — the form is checked in the browser
 * first: one that cannot pass is never sent and its field errors show at once; the server's
 * answer replaces them when it comes back. Such a form is submitted by hand rather than through
 * React's form action, so a refusal never empties what was typed. Without JavaScript the action
 * is still the form's action (progressive enhancement).
 *
 * `status="placed"`: the form places <ActionFormStatus /> itself (beside its buttons) instead of
 * the status line closing the form. `confirm`: a question the browser asks before anything is
 * sent (deleting a row).
 */
export function ActionForm({
  action,
  schema,
  children,
  className = '',
  statusClassName = '',
  status = 'end',
  showSuccess = true,
  resetOnSuccess = false,
  confirm,
  'aria-label': ariaLabel,
  id,
}: {
  action: FormAction;
  schema?: z.ZodType;
  confirm?: string;
  children: ReactNode;
  className?: string;
  statusClassName?: string;
  status?: 'end' | 'placed';
  showSuccess?: boolean;
  resetOnSuccess?: boolean;
  'aria-label'?: string;
  id?: string;
}) {
  const [answer, formAction, pending] = useActionState(action as (prev: ActionState<unknown> | null, formData: FormData) => Promise<ActionState<unknown>>, null);
  const ref = useRef<HTMLFormElement>(null);
  const [refusal, setRefusal] = useState<ActionState<unknown> | null>(null);
  const [edited, setEdited] = useState<ReadonlySet<string>>(new Set());
  const [seenAnswer, setSeenAnswer] = useState(answer);
  if (seenAnswer !== answer) {
    // A new answer from the server: its errors (if any) take over from the browser's.
    setSeenAnswer(answer);
    setRefusal(null);
    setEdited(new Set());
  }
  useEffect(() => {
    if (answer?.ok && resetOnSuccess) ref.current?.reset();
  }, [answer, resetOnSuccess]);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    if (confirm !== undefined && !window.confirm(confirm)) {
      event.preventDefault();
      return;
    }
    if (!schema) return;
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = schema.safeParse(formObject(form));
    setEdited(new Set());
    if (!parsed.success) {
      setRefusal({ ok: false, error: CHECK_FIELDS, fieldErrors: fieldErrorsFrom(parsed.error) });
      return;
    }
    setRefusal(null);
    const data = new FormData(form);
    startTransition(() => formAction(data));
  };
  const onInput = (event: FormEvent<HTMLFormElement>) => {
    const name = (event.target as HTMLInputElement).name;
    if (name && !edited.has(name)) setEdited(new Set([...edited, name]));
  };
  const state = refusal ?? answer;
  return (
    <FormContext.Provider value={{ state, pending, edited }}>
      <form ref={ref} action={formAction} onSubmit={onSubmit} onInput={onInput} className={className} aria-label={ariaLabel} id={id} noValidate>
        {children}
        {status === 'end' && <FormStatus state={state} showSuccess={showSuccess} className={statusClassName} />}
      </form>
    </FormContext.Provider>
  );
}

/** The status line of an ActionForm with `status="placed"`, wherever the form puts it. */
export function ActionFormStatus({ showSuccess = true, className = '' }: { showSuccess?: boolean; className?: string }) {
  return <FormStatus state={useFormState()} showSuccess={showSuccess} className={className} />;
}
