'use client';

import { startTransition, useActionState, useEffect, useRef, useState, type FormEvent } from 'react';
import type { z } from 'zod';
import type { ActionState } from '@/server/actions/safe-action';
import { formObject, issuesByField } from './form-fields';

type Action<T> = (prev: ActionState<T> | null, input: FormData) => Promise<ActionState<T>>;

/**
 * A server action form with the same zod schema run in the browser first: a form that cannot
 * pass is never sent, and its field errors show at once; the server's answer (and its own field
 * errors) replaces them when it comes back.
 */
export function useValidatedAction<T>(action: Action<T>, schema: z.ZodType, opts: { resetOnSuccess?: boolean } = {}) {
  const [state, formAction, pending] = useActionState(action, null);
  const formRef = useRef<HTMLFormElement | null>(null);
  const reset = opts.resetOnSuccess ?? false;
  useEffect(() => {
    // A saved form is emptied for the next entry; a refused one keeps what was typed.
    if (reset && state?.ok) formRef.current?.reset();
  }, [state, reset]);
  const [clientErrors, setClientErrors] = useState<Record<string, string[]> | null>(null);
  // Fields edited since the last check: their old message is hidden so the new value speaks for itself.
  const [edited, setEdited] = useState<ReadonlySet<string>>(new Set());
  const [seenState, setSeenState] = useState(state);
  if (seenState !== state) {
    // A new answer from the server: its errors (if any) take over from the browser's.
    setSeenState(state);
    setClientErrors(null);
    setEdited(new Set());
  }
  // Submitted by hand (not through the form's action prop) so React does not reset the form:
  // after a refusal every box keeps what was typed. Without JavaScript the action prop still works.
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    formRef.current = form;
    const parsed = schema.safeParse(formObject(form));
    if (!parsed.success) {
      setClientErrors(issuesByField(parsed.error.issues));
      setEdited(new Set());
      return;
    }
    setClientErrors(null);
    setEdited(new Set());
    const data = new FormData(form);
    startTransition(() => formAction(data));
  };
  const onInput = (event: FormEvent<HTMLFormElement>) => {
    const name = (event.target as HTMLInputElement).name;
    if (name && !edited.has(name)) setEdited(new Set([...edited, name]));
  };
  const serverErrors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const errors: Record<string, string[]> = Object.fromEntries(Object.entries(clientErrors ?? serverErrors).filter(([k]) => !edited.has(k)));
  const message = clientErrors ? 'Please check the highlighted fields.' : state ? (state.ok ? (state.message ?? '') : state.error) : '';
  const failed = clientErrors !== null || (state !== null && !state.ok);
  return { state, formAction, pending, onSubmit, onInput, errors, message, failed };
}
