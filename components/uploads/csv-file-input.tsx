'use client';

import { useFieldErrors } from '@/components/ui/action-form';
import { INPUT_CLASSES } from '@/components/ui/field';

/**
 * The CSV file picker of the upload and campaign forms. A file over the size limit is refused
 * here, before it is sent (the server checks again); the parent keeps that message to disable
 * its buttons. Server errors for the file (from the surrounding form's answer) show under it.
 */
export function CsvFileInput({ id, label, maxBytes, limitedNoun, tooBig, onPick }: {
  id: string;
  label: string;
  maxBytes: number;
  /** "uploads are limited to …", "campaign files are limited to …" */
  limitedNoun: string;
  tooBig: string | null;
  onPick: (tooBig: string | null) => void;
}) {
  const errors = useFieldErrors('file');
  const errorId = `${id}-error`;
  return (
    <div>
      <label className="block text-sm font-medium text-stone-800" htmlFor={id}>
        {label}
      </label>
      <input
        id={id}
        name="file"
        type="file"
        accept=".csv,text/csv,text/plain"
        className={`${INPUT_CLASSES} mt-1 file:mr-3 file:rounded file:border-0 file:bg-ledger-50 file:px-2 file:py-1 file:text-ledger-800`}
        aria-describedby={errors.length || tooBig ? errorId : undefined}
        onChange={(e) => {
          const f = e.target.files?.[0];
          onPick(f && f.size > maxBytes ? `"${f.name}" is ${Math.ceil(f.size / 1024)} KiB; ${limitedNoun} are limited to ${maxBytes / 1024} KiB.` : null);
        }}
      />
      {(tooBig || errors.length > 0) && (
        <p id={errorId} className="mt-1 max-h-24 overflow-auto text-xs text-red-700">
          {tooBig ?? errors.slice(0, 3).join(' ')}
        </p>
      )}
    </div>
  );
}
