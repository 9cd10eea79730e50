'use client';

import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

/**
 * Labelled inputs for the part-A forms that validate in the browser with the same zod schema
 * as the server action: errors come in as a prop (client check first, then the action's answer).
 */
export const INPUT_CLASSES =
  'block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs placeholder:text-stone-400 focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200 aria-[invalid=true]:border-red-400';

function Shell({ id, label, hint, errors, children, className = '' }: { id: string; label: ReactNode; hint?: ReactNode; errors?: string[]; children: ReactNode; className?: string }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      <div className="mt-1">{children}</div>
      {hint && !errors?.length && (
        <p id={`${id}-hint`} className="mt-1 text-xs text-stone-600">
          {hint}
        </p>
      )}
      {errors && errors.length > 0 && (
        <p id={`${id}-error`} className="mt-1 text-xs text-red-700">
          {errors.join(' ')}
        </p>
      )}
    </div>
  );
}

export function TextInput({ label, hint, errors, className, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; name: string; hint?: ReactNode; errors?: string[] }) {
  const id = useId();
  return (
    <Shell id={id} label={label} hint={hint} errors={errors} className={className}>
      <input
        id={id}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={errors?.length ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={INPUT_CLASSES}
        {...input}
      />
    </Shell>
  );
}

export function SelectInput({
  label,
  hint,
  errors,
  className,
  options,
  placeholder,
  ...select
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; name: string; hint?: ReactNode; errors?: string[]; options: readonly { value: string; label: string }[]; placeholder?: string }) {
  const id = useId();
  return (
    <Shell id={id} label={label} hint={hint} errors={errors} className={className}>
      <select
        id={id}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={errors?.length ? `${id}-error` : hint ? `${id}-hint` : undefined}
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
    </Shell>
  );
}

export function TextArea({ label, hint, errors, className, ...area }: React.TextareaHTMLAttributes<HTMLTextAreaElement> & { label: ReactNode; name: string; hint?: ReactNode; errors?: string[] }) {
  const id = useId();
  return (
    <Shell id={id} label={label} hint={hint} errors={errors} className={className}>
      <textarea id={id} rows={3} aria-invalid={errors?.length ? true : undefined} aria-describedby={errors?.length ? `${id}-error` : hint ? `${id}-hint` : undefined} className={INPUT_CLASSES} {...area} />
    </Shell>
  );
}

/** FormData → plain object as the server's safeAction builds it (repeated names become arrays). */
export function formObject(form: HTMLFormElement): Record<string, unknown> {
  const data = new FormData(form);
  const out: Record<string, unknown> = {};
  for (const key of new Set(data.keys())) {
    const all = data.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}

/** zod issues → { field: messages } (first path segment: the form's field name). */
export function issuesByField(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const i of issues) {
    const key = i.path.length ? String(i.path[0]) : '_form';
    (out[key] ??= []).push(i.message);
  }
  return out;
}
