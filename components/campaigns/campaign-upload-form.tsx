'use client';

import { useRef, useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { INPUT_CLASSES } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { EACH_SITE_CLIMATE, EACH_SITE_CLIMATE_LABEL } from '@/server/validation/campaign';

export type CampaignChoices = { services: { value: string; label: string }[]; climates: { value: string; label: string }[] };

type Field = 'file' | 'service' | 'target';
type Sending = { state: 'idle' } | { state: 'sending'; percent: number | null } | { state: 'error'; message: string; field?: Field };

const FIELD_IDS: Record<Field, string> = { file: 'campaign-file', service: 'campaign-service', target: 'campaign-target' };
// The upload route's field names → the box to mark and focus.
const FIELD_OF: Record<string, Field> = { filename: 'file', serviceProfileId: 'service', targetAvailabilityPercent: 'target' };
const ERROR_ID = 'campaign-upload-error';

/**
 * Upload a CSV of existing customer sites (up to a million) and start the campaign. The file is
 * sent as the request body of POST /api/campaign-uploads (XMLHttpRequest, for the upload's own
 * progress bar); the server reads it as it streams in and answers once every chunk is queued,
 * then the campaign's page shows the computation's progress.
 */
export function CampaignUploadForm({ choices, siteLimit }: { choices: CampaignChoices; siteLimit: number }) {
  const router = useRouter();
  const [sending, setSending] = useState<Sending>({ state: 'idle' });
  const formRef = useRef<HTMLFormElement>(null);

  // A problem marks its box and moves the focus there (keyboard and screen-reader users land on it); nothing typed is lost.
  function fail(message: string, field?: Field) {
    setSending({ state: 'error', message, field });
    if (field) document.getElementById(FIELD_IDS[field])?.focus();
  }
  const invalid = (field: Field) => (sending.state === 'error' && sending.field === field ? { 'aria-invalid': true as const } : {});
  const describedBy = (field: Field, hint?: string) => [hint, sending.state === 'error' && sending.field === field ? ERROR_ID : null].filter(Boolean).join(' ') || undefined;

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const file = form.get('file');
    if (!(file instanceof File) || file.size === 0) {
      fail('Choose a CSV file of customer sites.', 'file');
      return;
    }
    if (!form.get('serviceProfileId')) {
      fail('Choose the service every site is computed with.', 'service');
      return;
    }
    const params = new URLSearchParams({
      filename: file.name,
      serviceProfileId: String(form.get('serviceProfileId')),
      climateProfileId: String(form.get('climateProfileId') ?? EACH_SITE_CLIMATE),
      targetAvailabilityPercent: String(form.get('targetAvailabilityPercent') ?? ''),
    });
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/campaign-uploads?${params}`);
    xhr.setRequestHeader('Content-Type', 'text/csv');
    xhr.upload.onprogress = (p) => setSending({ state: 'sending', percent: p.lengthComputable ? Math.floor((100 * p.loaded) / p.total) : null });
    xhr.onerror = () => fail('The file could not be sent (the connection dropped). Nothing was queued; try again.');
    xhr.onload = () => {
      let body: { id?: number; error?: { message?: string; fieldErrors?: Record<string, string[]> } } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // not JSON: the status says enough
      }
      if (xhr.status === 202 && body.id) {
        router.push(`/campaigns/${body.id}`);
        return;
      }
      const fields = body.error?.fieldErrors ? Object.values(body.error.fieldErrors).flat().join(' ') : '';
      const first = Object.keys(body.error?.fieldErrors ?? {}).map((k) => FIELD_OF[k]).find(Boolean);
      fail(`${body.error?.message ?? `The server answered ${xhr.status}.`}${fields ? ` ${fields}` : ''}`, first);
    };
    setSending({ state: 'sending', percent: 0 });
    xhr.send(file);
  }

  const busy = sending.state === 'sending';
  return (
    <form ref={formRef} onSubmit={submit} className="space-y-4" aria-label="New upgrade campaign" noValidate>
      <p className="text-sm text-stone-600">
        Columns: <code className="rounded bg-stone-100 px-1 font-mono text-xs">site_ref, latitude, longitude, altitude_m, current_dish_cm</code>. Latitude and longitude in decimal degrees
        or degrees, minutes and seconds; altitude_m may be blank or left out (the ITU-R P.1511-1 height at the site is used). Any current dish size is accepted: a size not in
        your catalogue is computed at 65 % aperture efficiency (a usual figure for consumer dishes). Comma, semicolon or tab separated, UTF-8, up to{' '}
        {siteLimit.toLocaleString('en-US')} sites on your plan.
        <span className="block text-xs">
          Example line: <code className="font-mono">HOLM-0042,47°30&apos;15&quot; N,2.25,140,45</code>
        </span>
      </p>
      <div>
        <label className="block text-sm font-medium text-stone-800" htmlFor="campaign-file">
          Sites file (CSV)
        </label>
        <input id="campaign-file" name="file" type="file" accept=".csv,text/csv,text/plain" {...invalid('file')} aria-describedby={describedBy('file')} className={`${INPUT_CLASSES} mt-1 file:mr-3 file:rounded file:border-0 file:bg-ledger-50 file:px-2 file:py-1 file:text-ledger-800`} />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <div>
          <label className="block text-sm font-medium text-stone-800" htmlFor="campaign-service">
            Service
          </label>
          <select id="campaign-service" name="serviceProfileId" className={`${INPUT_CLASSES} mt-1`} defaultValue="" {...invalid('service')} aria-describedby={describedBy('service')}>
            <option value="">Choose a service</option>
            {choices.services.map((s) => (
              <option key={s.value} value={s.value}>
                {s.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label className="block text-sm font-medium text-stone-800" htmlFor="campaign-climate">
            Rain climate
          </label>
          <select id="campaign-climate" name="climateProfileId" className={`${INPUT_CLASSES} mt-1`} defaultValue={EACH_SITE_CLIMATE} aria-describedby="campaign-climate-hint">
            {[{ value: EACH_SITE_CLIMATE, label: EACH_SITE_CLIMATE_LABEL }, ...choices.climates].map((c) => (
              <option key={c.value} value={c.value}>
                {c.label}
              </option>
            ))}
          </select>
          <p id="campaign-climate-hint" className="mt-1 text-xs text-stone-600">
            A climate profile replaces every site&apos;s own rain climate; use one only when it holds better local data for all of them.
          </p>
        </div>
        <div>
          <label className="block text-sm font-medium text-stone-800" htmlFor="campaign-target">
            Target availability (%)
          </label>
          <input id="campaign-target" name="targetAvailabilityPercent" inputMode="decimal" defaultValue="99.9" className={`${INPUT_CLASSES} mt-1`} {...invalid('target')} aria-describedby={describedBy('target', 'campaign-target-hint')} />
          <p id="campaign-target-hint" className="mt-1 text-xs text-stone-600">
            Of an average year, 90–99.999 %.
          </p>
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={busy}>
          {busy ? 'Sending the file…' : 'Start the campaign'}
        </Button>
        <p role="status" aria-live="polite" className="text-sm text-stone-700">
          {sending.state === 'sending' && (sending.percent === null ? 'Sending…' : sending.percent < 100 ? `Sending: ${sending.percent} %` : 'Reading the file and queueing its sites…')}
        </p>
      </div>
      {sending.state === 'error' && (
        <p id={ERROR_ID} role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800">
          {sending.message}
        </p>
      )}
    </form>
  );
}
