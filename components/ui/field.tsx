'use client';

import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { useFieldErrors, useFormState } from './action-form';

/** The look of every text box, select and file picker. */
export const INPUT_CLASSES =
  'block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs placeholder:text-stone-400 focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200 aria-[invalid=true]:border-red-400';

/** The field's messages and, after a refusal, the value typed (the action echoes no secrets). */
function useFieldState(name: string) {
  const state = useFormState();
  const errors = useFieldErrors(name);
  const echoed = state && !state.ok ? state.values?.[name] : undefined;
  return { errors, echoed };
}

function FieldShell({ id, label, hint, errors, children, className = '' }: { id: string; label: ReactNode; hint?: ReactNode; errors: string[]; children: ReactNode; className?: string }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      <div className="mt-1">{children}</div>
      {hint && !errors.length && (
        <p id={`${id}-hint`} className="mt-1 text-xs text-stone-600">
          {hint}
        </p>
      )}
      {errors.length > 0 && (
        <p id={`${id}-error`} className="mt-1 text-xs text-red-700">
          {errors.join(' ')}
        </p>
      )}
    </div>
  );
}

const describedBy = (id: string, errors: string[], hint: ReactNode) => (errors.length ? `${id}-error` : hint ? `${id}-hint` : undefined);

/**
 * A labelled input. Inside an ActionForm it shows the field errors for its name and, after a
 * failed submit, refills what was typed (never passwords: the action does not echo them). A
 * controlled box (`value`) keeps its own value.
 */
export function Field({ label, name, hint, className, defaultValue, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; name: string; hint?: ReactNode }) {
  const id = useId();
  const { errors, echoed } = useFieldState(name);
  const controlled = input.value !== undefined;
  return (
    <FieldShell id={id} label={label} hint={hint} errors={errors} className={className}>
      <input
        id={id}
        name={name}
        // A new key after each answer lets the refilled default value take effect.
        key={controlled ? 'controlled' : (echoed ?? 'initial')}
        defaultValue={controlled || input.type === 'password' ? undefined : (echoed ?? defaultValue)}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={describedBy(id, errors, hint)}
        className={INPUT_CLASSES}
        {...input}
      />
    </FieldShell>
  );
}

export function SelectField({
  label,
  name,
  hint,
  className,
  options,
  placeholder,
  defaultValue,
  ...select
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; name: string; hint?: ReactNode; options: readonly { value: string; label: string }[]; placeholder?: string }) {
  const id = useId();
  const { errors, echoed } = useFieldState(name);
  const controlled = select.value !== undefined;
  return (
    <FieldShell id={id} label={label} hint={hint} errors={errors} className={className}>
      <select
        id={id}
        name={name}
        key={controlled ? 'controlled' : (echoed ?? 'initial')}
        defaultValue={controlled ? undefined : (echoed ?? (defaultValue as string | undefined))}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={describedBy(id, errors, hint)}
        className={INPUT_CLASSES}
        {...select}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

export function TextAreaField({ label, name, hint, className, defaultValue, ...area }: TextareaHTMLAttributes<HTMLTextAreaElement> & { label: ReactNode; name: string; hint?: ReactNode }) {
  const id = useId();
  const { errors, echoed } = useFieldState(name);
  return (
    <FieldShell id={id} label={label} hint={hint} errors={errors} className={className}>
      <textarea
        id={id}
        name={name}
        rows={3}
        key={echoed ?? 'initial'}
        defaultValue={echoed ?? defaultValue}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={describedBy(id, errors, hint)}
        className={INPUT_CLASSES}
        {...area}
      />
    </FieldShell>
  );
}

/** Errors that belong to the whole form, a group of boxes or a hidden field, shown as one line. */
export function FormErrors({ names, id }: { names: string[]; id?: string }) {
  const messages = useFieldErrors(...names);
  if (!messages.length) return null;
  return (
    <p id={id} className="text-sm text-red-700">
      {messages.join(' ')}
    </p>
  );
}
