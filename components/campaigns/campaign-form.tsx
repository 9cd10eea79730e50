'use client';

import { useState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import type { CampaignResponse } from '@/server/campaigns/run-campaign';
import { CAMPAIGN_MAX_BYTES, CAMPAIGN_MAX_ROWS } from '@/server/campaigns/campaign-csv';
import { verdictWords } from '@/server/campaigns/campaign-result-csv';
import { ActionForm, ActionFormStatus, useFormState } from '@/components/ui/action-form';
import { Field, SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';
import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { CsvFileInput } from '@/components/uploads/csv-file-input';
import { fixed } from '@/components/study/format';
import { formatMoney } from '@/server/money-format';
import { readCampaignRow } from '@/server/campaigns/campaign-row-reading';
import { campaignSchema, EACH_SITE_CLIMATE, EACH_SITE_CLIMATE_LABEL } from '@/server/validation/campaign';

type Act = (prev: ActionState<CampaignResponse> | null, input: FormData) => Promise<ActionState<CampaignResponse>>;
export type CampaignChoices = { services: { value: string; label: string }[]; climates: { value: string; label: string }[] };

/** The result file is made on the server; the browser only saves it (nothing is kept on our side). */
function download(data: CampaignResponse) {
  const url = URL.createObjectURL(new Blob([data.csv], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = data.csvFilename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  URL.revokeObjectURL(url);
}

function Counts({ data }: { data: CampaignResponse }) {
  const c = data.counts;
  const items: [string, number][] = [
    ['sites in the file', c.rows],
    ['computed', c.computed],
    ['to upgrade', c.upgrade],
    ['already meet the target', c.alreadyMeetsTarget],
    ['no dish meets the target', c.noneMeetsTarget],
    ['problems', c.problems],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
      {items.map(([label, n]) => (
        <div key={label} className="rounded border border-stone-200 px-3 py-2">
          <dt className="text-xs text-stone-600">{label}</dt>
          <dd className="num text-lg font-semibold text-stone-900">{n.toLocaleString('en-US')}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The last campaign the form computed, under it. */
function CampaignResults() {
  const state = useFormState();
  const data = state?.ok ? ((state.data as CampaignResponse | undefined) ?? null) : null;
  return data ? <Results data={data} /> : null;
}

function Results({ data }: { data: CampaignResponse }) {
  const shown = data.results.length;
  return (
    <div className="mt-6 space-y-4" aria-live="polite">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-stone-700">
          <strong>{data.filename}</strong> with {data.serviceName}, target {fixed(data.targetAvailabilityPercent, 3)} %, over {data.dishCount} active dish{data.dishCount === 1 ? '' : 'es'}. Rain climate:{' '}
          {data.climateOverride ? <>the profile “{data.climateName}” for every site (override); gases, clouds and altitude still from each site&apos;s coordinates.</> : <>{data.climateName.charAt(0).toLowerCase() + data.climateName.slice(1)}.</>}
        </p>
        <Button variant="secondary" onClick={() => download(data)}>
          Download all results (CSV)
        </Button>
      </div>
      <Counts data={data} />
      {data.problems.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-stone-900">Rows not computed</h3>
          <ul className="mt-1 max-h-48 list-disc space-y-0.5 overflow-auto rounded border border-red-200 bg-red-50 py-2 pl-8 pr-3 text-sm text-red-800">
            {data.problems.map((p, i) => (
              <li key={i}>{p.message}</li>
            ))}
            {data.counts.problems > data.problems.length && <li>…and {data.counts.problems - data.problems.length} more, all listed in the CSV.</li>}
          </ul>
        </div>
      )}
      {shown > 0 && (
        <>
          {data.counts.computed > shown && <p className="text-xs text-stone-600">The first {shown} of {data.counts.computed} computed sites; the CSV has them all.</p>}
          <Table caption="Upgrade recommendation per site">
            <THead>
              <tr>
                <Th numeric className="hidden sm:table-cell">Line</Th>
                <Th>Site</Th>
                <Th numeric>Dish now (cm)</Th>
                <Th numeric>Outage now (min/year)</Th>
                <Th numeric className="hidden lg:table-cell">R0.01 (mm/h)</Th>
                <Th numeric className="hidden md:table-cell">Availability now</Th>
                <Th>Recommendation</Th>
                <Th numeric className="hidden md:table-cell">Outage after (min/year)</Th>
                <Th numeric>Saved (min/year)</Th>
                <Th numeric>Upgrade price</Th>
              </tr>
            </THead>
            <TBody>
              {data.results.map((r) => {
                // Minutes in cells whose header carries the unit; a bound keeps its sign.
                const read = readCampaignRow(r);
                return (
                <tr key={r.line}>
                  <Td numeric className="hidden sm:table-cell">{r.line}</Td>
                  <Th scope="row" className="whitespace-nowrap align-top font-medium text-stone-900">{r.siteRef}</Th>
                  <Td numeric className="whitespace-nowrap">{r.currentDishCm}</Td>
                  <Td numeric className="whitespace-nowrap">{read.current.minutesNumber}</Td>
                  <Td numeric className="hidden whitespace-nowrap lg:table-cell">{fixed(r.climate.r001MmH, 1)}</Td>
                  <Td numeric className="hidden whitespace-nowrap md:table-cell">{read.current.availabilityText}</Td>
                  <Td className="whitespace-nowrap">{r.verdict === 'upgrade' ? <span className="font-medium text-ledger-800">{r.recommendedDishCm} cm · {r.recommendedDishName}</span> : <span className="text-stone-600">{verdictWords(r.verdict)}</span>}</Td>
                  <Td numeric className="hidden whitespace-nowrap md:table-cell">{read.recommended?.minutesNumber ?? '—'}</Td>
                  <Td numeric className="whitespace-nowrap">{read.saved?.number ?? '—'}</Td>
                  <Td numeric className="whitespace-nowrap">{formatMoney(r.upgradePriceUsd)}</Td>
                </tr>
                );
              })}
            </TBody>
          </Table>
        </>
      )}
    </div>
  );
}

/**
 * Upload a CSV of existing customer sites, pick the service and target (and, only as an override,
 * a rain climate profile), and read the upgrade recommendation for every site, each computed with
 * its own climate from the ITU-R maps. Computed on each request; nothing is stored.
 */
export function CampaignForm({ choices, action }: { choices: CampaignChoices; action: Act }) {
  const [tooBig, setTooBig] = useState<string | null>(null);
  return (
    <ActionForm action={action} schema={campaignSchema} status="placed" className="space-y-4" aria-label="Upgrade campaign">
      <p className="text-sm text-stone-600">
        Columns: <code className="rounded bg-stone-100 px-1 font-mono text-xs">site_ref, latitude, longitude, altitude_m, current_dish_cm</code>. Latitude and longitude in decimal degrees
        or degrees, minutes and seconds; altitude_m may be blank or left out (the ITU-R P.1511-1 height at the site is used). Comma, semicolon or tab separated, UTF-8, at most{' '}
        {CAMPAIGN_MAX_ROWS.toLocaleString('en-US')} sites and {CAMPAIGN_MAX_BYTES / 1024} KiB.
        <span className="block text-xs">
          Example line: <code className="font-mono">HOLM-0042,47°30&apos;15&quot; N,2.25,140,60</code>
        </span>
      </p>
      <CsvFileInput id="campaign-file" label="Sites file (CSV)" maxBytes={CAMPAIGN_MAX_BYTES} limitedNoun="campaign files" tooBig={tooBig} onPick={setTooBig} />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="Service" name="serviceProfileId" options={choices.services} placeholder="Choose a service" />
        <SelectField
          label="Rain climate"
          name="climateProfileId"
          defaultValue={EACH_SITE_CLIMATE}
          options={[{ value: EACH_SITE_CLIMATE, label: EACH_SITE_CLIMATE_LABEL }, ...choices.climates]}
          hint="A climate profile replaces every site's own rain climate; use one only when it holds better local data for all of them."
        />
        <Field label="Target availability (%)" name="targetAvailabilityPercent" inputMode="decimal" defaultValue="99.9" hint="Of an average year, 90–99.999 %." />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pendingLabel="Computing…" disabled={tooBig !== null}>
          Compute the campaign
        </SubmitButton>
        <ActionFormStatus />
      </div>
      <CampaignResults />
    </ActionForm>
  );
}
