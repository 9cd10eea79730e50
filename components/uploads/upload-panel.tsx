'use client';

import { startTransition, useActionState, useRef, useState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import type { ParseReport } from '@/server/uploads/parse-report';
import { MAX_UPLOAD_BYTES } from '@/server/uploads/upload-limits';
import { Button } from '@/components/ui/button';
import { FormStatus } from '@/components/ui/form-status';
import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { FormStateProvider } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { CsvFileInput } from './csv-file-input';
import { previewColumnLabel } from './preview-columns';
import { PlaceFields } from '@/components/climate/place-fields';

type Act = (prev: ActionState<never> | null, input: FormData) => Promise<ActionState<unknown>>;
type Bound = (prev: ActionState<unknown> | null, input: FormData) => Promise<ActionState<unknown>>;

export type UploadKindChoice = { value: string; label: string; columns: string; example: string };

function ReportView({ report }: { report: ParseReport }) {
  const cols = report.preview.length ? Object.keys(report.preview[0]) : [];
  return (
    <div className="mt-4 space-y-3" aria-live="polite">
      <p className={`text-sm ${report.ok ? 'text-ledger-800' : 'text-red-700'}`}>
        <strong>{report.filename}</strong> ({Math.ceil(report.sizeBytes / 1024)} KiB, {report.rowCount} data row{report.rowCount === 1 ? '' : 's'}): {report.summary}
      </p>
      {report.ignoredColumns.length > 0 && <p className="text-xs text-stone-600">Columns not used: {report.ignoredColumns.join(', ')}.</p>}
      {report.problems.length > 0 && (
        <ul className="max-h-60 list-disc space-y-0.5 overflow-auto rounded border border-red-200 bg-red-50 py-2 pl-8 pr-3 text-sm text-red-800">
          {report.problems.map((p, i) => (
            <li key={i}>{p.message}</li>
          ))}
          {report.problemCount > report.problems.length && <li>…and {report.problemCount - report.problems.length} more.</li>}
        </ul>
      )}
      {report.ok && report.preview.length > 0 && (
        <Table caption="Rows as they will be saved">
          <THead>
            <tr>
              {cols.map((c) => (
                <Th key={c} numeric={typeof report.preview[0][c] === 'number'} className="normal-case">
                  {previewColumnLabel(c)}
                </Th>
              ))}
            </tr>
          </THead>
          <TBody>
            {report.preview.slice(0, 20).map((row, i) => (
              <tr key={i}>
                {cols.map((c) => (
                  <Td key={c} numeric={typeof row[c] === 'number'}>
                    {row[c] === null ? '—' : typeof row[c] === 'boolean' ? (row[c] ? 'yes' : 'no') : String(row[c])}
                  </Td>
                ))}
              </tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}

/**
 * CSV upload in two steps: Preview (parsed on the server, row-level problems with line numbers,
 * nothing saved) and Save (parsed again, saved only if every row is valid, in one transaction,
 * with the original file kept beside its report).
 */
export function UploadPanel({ kinds, preview, confirm, needsProfileFields }: { kinds: UploadKindChoice[]; preview: Act; confirm: Act; needsProfileFields: boolean }) {
  const form = useRef<HTMLFormElement>(null);
  const [kind, setKind] = useState(kinds[0].value);
  const [previewState, previewAction, previewing] = useActionState(preview as unknown as Bound, null);
  const [confirmState, confirmAction, saving] = useActionState(confirm as unknown as Bound, null);
  const [tooBig, setTooBig] = useState<string | null>(null);
  // A changed file (or kind) must be previewed again before it can be saved.
  const [stale, setStale] = useState(true);
  const report = previewState?.ok ? (previewState.data as ParseReport) : null;
  const choice = kinds.find((k) => k.value === kind) ?? kinds[0];

  const run = (which: 'preview' | 'confirm') => {
    if (!form.current) return;
    const data = new FormData(form.current);
    if (which === 'preview') setStale(false);
    // The action's revalidatePath refreshes the lists on this page once the save is done.
    startTransition(() => (which === 'preview' ? previewAction(data) : confirmAction(data)));
  };
  // Two actions behind two buttons: the fields read the errors of whichever refused last (saving first).
  const refusal = confirmState && !confirmState.ok && confirmState.fieldErrors ? confirmState : previewState && !previewState.ok ? previewState : null;

  return (
    <form ref={form} onSubmit={(e) => e.preventDefault()} className="space-y-4" aria-label="Upload a CSV file">
      <FormStateProvider state={refusal}>
        {kinds.length > 1 ? (
          <fieldset>
            <legend className="text-sm font-medium text-stone-800">The file holds</legend>
            <div className="mt-1 flex flex-wrap gap-4">
              {kinds.map((k) => (
                <label key={k.value} className="inline-flex items-center gap-1.5 text-sm">
                  <input type="radio" name="kind" value={k.value} checked={kind === k.value} onChange={() => {
                      setKind(k.value);
                      setStale(true);
                    }} className="accent-ledger-700" />
                  {k.label}
                </label>
              ))}
            </div>
          </fieldset>
        ) : (
          <input type="hidden" name="kind" value={kinds[0].value} />
        )}
        <p className="text-sm text-stone-600">
          Columns: <code className="rounded bg-stone-100 px-1 font-mono text-xs">{choice.columns}</code>. Comma, semicolon or tab separated, UTF-8, at most {MAX_UPLOAD_BYTES / 1024} KiB.
          <span className="block text-xs">Example line: <code className="font-mono">{choice.example}</code></span>
        </p>
        <CsvFileInput
          id="upload-file"
          label="CSV file"
          maxBytes={MAX_UPLOAD_BYTES}
          limitedNoun="uploads"
          tooBig={tooBig}
          onPick={(message) => {
            setStale(true);
            setTooBig(message);
          }}
        />
        {needsProfileFields && kind !== 'dish-catalogue' && (
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Profile name" name="name" />
            <Field label="Source of the figures" name="sourceNote" placeholder="Weather service, station, years" />
            <Field label="0 °C isotherm height (km, optional)" name="zeroIsothermKm" inputMode="decimal" hint="ITU-R P.839-4 h0; blank takes the P.839-4 map value at each study's site." />
            <PlaceFields className="sm:col-span-2" />
          </div>
        )}
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" onClick={() => run('preview')} disabled={previewing || saving || tooBig !== null}>
            {previewing ? 'Reading…' : 'Preview'}
          </Button>
          <Button onClick={() => run('confirm')} disabled={stale || !report?.ok || saving || previewing || tooBig !== null}>
            {saving ? 'Saving…' : 'Save'}
          </Button>
          <FormStatus state={confirmState ?? (previewState && !previewState.ok ? previewState : null)} />
        </div>
        {report && !stale && <ReportView report={report} />}
      </FormStateProvider>
    </form>
  );
}
