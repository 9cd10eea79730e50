'use client';

import { useState } from 'react';
import { createSite, updateSite } from '@/server/actions/sites';
import { siteSchema, siteUpdateSchema } from '@/server/validation/site';
import { formatDms, parseCoordinate } from '@/server/validation/coordinates';
import { SelectInput, TextArea, TextInput } from '@/components/study/form-fields';
import { useValidatedAction } from '@/components/study/use-validated-action';
import { useAfterSave } from './use-after-save';
import { SaveRow } from './save-row';

function Echo({ text, axis }: { text: string; axis: 'lat' | 'lon' }) {
  if (!text.trim()) return <>Decimal degrees or DMS, e.g. {axis === 'lat' ? `47°07'24"N` : `2°39'15"E`}</>;
  const r = parseCoordinate(text, axis);
  return <span className={r.ok ? '' : 'text-amber-800'}>{r.ok ? `= ${r.value}° (${formatDms(r.value, axis)})` : r.error}</span>;
}

export type SiteFormValues = { id: number; customerId: number; name: string; address: string | null; latDeg: number; lonDeg: number; altitudeM: number; altitudeSource: 'user' | 'itu-r-p1511-1'; notes: string | null };

/**
 * A new site for a customer, or (with `site`) changes to one; coordinates in decimal degrees or
 * degrees-minutes-seconds. `onSaved` runs after the server accepted the change (the lists refresh).
 */
export function SiteForm({ customers, site, onSaved, onCancel }: { customers: { id: number; name: string }[]; site?: SiteFormValues; onSaved?: () => void; onCancel?: () => void }) {
  const { state, formAction, pending, onSubmit, onInput, errors, message, failed } = useValidatedAction(site ? updateSite : createSite, site ? siteUpdateSchema : siteSchema);
  const [lat, setLat] = useState(site ? String(site.latDeg) : '');
  const [lon, setLon] = useState(site ? String(site.lonDeg) : '');
  useAfterSave(state, '/api/v1/sites', onSaved);
  return (
    <form action={formAction} onSubmit={onSubmit} onInput={onInput} noValidate className="space-y-4" aria-label={site ? `Edit ${site.name}` : 'Add a site'}>
      {site && <input type="hidden" name="id" value={site.id} />}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <SelectInput
          label="Customer"
          name="customerId"
          placeholder="Choose a customer…"
          defaultValue={site ? String(site.customerId) : undefined}
          options={customers.map((c) => ({ value: String(c.id), label: c.name }))}
          errors={errors.customerId}
        />
        <TextInput label="Site name" name="name" defaultValue={site?.name} errors={errors.name} />
        <TextInput label="Address (optional)" name="address" defaultValue={site?.address ?? ''} errors={errors.address} />
        <TextInput label="Latitude" name="latDeg" value={lat} onChange={(e) => setLat(e.target.value)} autoComplete="off" hint={<Echo text={lat} axis="lat" />} errors={errors.latDeg} />
        <TextInput label="Longitude" name="lonDeg" value={lon} onChange={(e) => setLon(e.target.value)} autoComplete="off" hint={<Echo text={lon} axis="lon" />} errors={errors.lonDeg} />
        {/* A map altitude stays blank when editing, so it follows the coordinates if they change. */}
        <TextInput
          label="Altitude (m above sea level)"
          name="altitudeM"
          inputMode="decimal"
          defaultValue={site && site.altitudeSource === 'user' ? String(site.altitudeM) : ''}
          placeholder={site && site.altitudeSource !== 'user' ? `${site.altitudeM} (from the map)` : 'from the map'}
          hint="Blank: the ground height at the site from the ITU-R P.1511-1 map."
          errors={errors.altitudeM}
        />
        {site && <TextArea label="Notes (optional)" name="notes" defaultValue={site.notes ?? ''} errors={errors.notes} className="sm:col-span-2 lg:col-span-3" />}
      </div>
      <SaveRow pending={pending} label={site ? 'Save site' : 'Add site'} onCancel={onCancel} state={state} failed={failed} message={message} />
    </form>
  );
}
