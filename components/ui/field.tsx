'use client';

import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';
import { useFormState } from './action-form';

const INPUT =
  'block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs placeholder:text-stone-400 focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200 aria-[invalid=true]:border-red-400';

function useFieldState(name: string) {
  const state = useFormState();
  const errors = state && !state.ok ? (state.fieldErrors?.[name] ?? []) : [];
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
        <p id={`${id}-hint`} className="mt-1 text-xs text-stone-500">
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

/**
 * A labelled input. Inside an ActionForm it shows the action's field errors for its name and,
 * after a failed submit, refills what was typed (never passwords: the action does not echo them).
 */
export function Field({ label, name, hint, className, defaultValue, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; name: string; hint?: ReactNode }) {
  const id = useId();
  const { errors, echoed } = useFieldState(name);
  const described = errors.length ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <FieldShell id={id} label={label} hint={hint} errors={errors} className={className}>
      <input
        id={id}
        name={name}
        // A new key after each answer lets the refilled default value take effect.
        key={echoed ?? 'initial'}
        defaultValue={input.type === 'password' ? undefined : (echoed ?? defaultValue)}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={described}
        className={INPUT}
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
  defaultValue,
  ...select
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; name: string; hint?: ReactNode; options: readonly { value: string; label: string }[] }) {
  const id = useId();
  const { errors, echoed } = useFieldState(name);
  return (
    <FieldShell id={id} label={label} hint={hint} errors={errors} className={className}>
      <select
        id={id}
        name={name}
        key={echoed ?? 'initial'}
        defaultValue={echoed ?? (defaultValue as string | undefined)}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={errors.length ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={INPUT}
        {...select}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

/** Errors that belong to the whole form or a hidden field (e.g. a token), shown as one line. */
export function FormErrors({ names }: { names: string[] }) {
  const state = useFormState();
  if (!state || state.ok) return null;
  const messages = names.flatMap((n) => state.fieldErrors?.[n] ?? []);
  if (!messages.length) return null;
  return <p className="text-sm text-red-700">{messages.join(' ')}</p>;
}
