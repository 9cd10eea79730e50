'use client';

import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { useFieldErrors, useFormState } from './action-form';

/** The look of every text box, select and file picker. */
export const INPUT_CLASSES =
  'block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs placeholder:text-stone-400 focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200 aria-[invalid=true]:border-red-400';

/**
 * What every control shares: its id, the messages for its name and, after a refusal, the value
 * typed (the action echoes no secrets) as its default; a controlled box keeps its own value.
 */
function useControl(name: string, hint: ReactNode, defaultValue: unknown, opts: { controlled: boolean; secret?: boolean }) {
  const id = useId();
  const state = useFormState();
  const errors = useFieldErrors(name);
  const echoed = state && !state.ok ? state.values?.[name] : undefined;
  return {
    id,
    errors,
    // A new key after each answer lets the refilled default value take effect.
    key: opts.controlled ? 'controlled' : (echoed ?? 'initial'),
    props: {
      id,
      name,
      defaultValue: opts.controlled || opts.secret ? undefined : (echoed ?? (defaultValue as string | undefined)),
      'aria-invalid': errors.length > 0 || undefined,
      'aria-describedby': errors.length ? `${id}-error` : hint ? `${id}-hint` : undefined,
      className: INPUT_CLASSES,
    },
  };
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

/** A labelled input that shows its field errors from the surrounding ActionForm and refills what was typed (never passwords). */
export function Field({ label, name, hint, className, defaultValue, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; name: string; hint?: ReactNode }) {
  const c = useControl(name, hint, defaultValue, { controlled: input.value !== undefined, secret: input.type === 'password' });
  return (
    <FieldShell id={c.id} label={label} hint={hint} errors={c.errors} className={className}>
      <input key={c.key} {...c.props} {...input} />
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
  const c = useControl(name, hint, defaultValue, { controlled: select.value !== undefined });
  return (
    <FieldShell id={c.id} label={label} hint={hint} errors={c.errors} className={className}>
      <select key={c.key} {...c.props} {...select}>
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
  const c = useControl(name, hint, defaultValue, { controlled: area.value !== undefined });
  return (
    <FieldShell id={c.id} label={label} hint={hint} errors={c.errors} className={className}>
      <textarea key={c.key} rows={3} {...c.props} {...area} />
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
