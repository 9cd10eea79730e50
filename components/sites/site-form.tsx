'use client';

import { useState } from 'react';
import { createSite, updateSite } from '@/server/actions/sites';
import { siteSchema, siteUpdateSchema } from '@/server/validation/site';
import { formatDms, parseCoordinate } from '@/server/validation/coordinates';
import { ActionForm } from '@/components/ui/action-form';
import { Field, SelectField, TextAreaField } from '@/components/ui/field';
import { AfterSave } from './after-save';
import { SaveRow } from './save-row';
import { UseMyLocation } from './use-my-location';

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
  const [lat, setLat] = useState(site ? String(site.latDeg) : '');
  const [lon, setLon] = useState(site ? String(site.lonDeg) : '');
  return (
    <ActionForm action={site ? updateSite : createSite} schema={site ? siteUpdateSchema : siteSchema} status="placed" className="space-y-4" aria-label={site ? `Edit ${site.name}` : 'Add a site'}>
      <AfterSave listPrefix="/api/v1/sites" onSaved={onSaved} />
      {site && <input type="hidden" name="id" value={site.id} />}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <SelectField
          label="Customer"
          name="customerId"
          placeholder="Choose a customer…"
          defaultValue={site ? String(site.customerId) : undefined}
          options={customers.map((c) => ({ value: String(c.id), label: c.name }))}
        />
        <Field label="Site name" name="name" defaultValue={site?.name} />
        <Field label="Address (optional)" name="address" defaultValue={site?.address ?? ''} />
        <UseMyLocation
          onPosition={(la, lo) => {
            setLat(la);
            setLon(lo);
          }}
        />
        <Field label="Latitude" name="latDeg" value={lat} onChange={(e) => setLat(e.target.value)} autoComplete="off" hint={<Echo text={lat} axis="lat" />} />
        <Field label="Longitude" name="lonDeg" value={lon} onChange={(e) => setLon(e.target.value)} autoComplete="off" hint={<Echo text={lon} axis="lon" />} />
        {/* A map altitude stays blank when editing, so it follows the coordinates if they change. */}
        <Field
          label="Altitude (m above sea level)"
          name="altitudeM"
          inputMode="decimal"
          defaultValue={site && site.altitudeSource === 'user' ? String(site.altitudeM) : ''}
          placeholder={site && site.altitudeSource !== 'user' ? `${site.altitudeM} (from the map)` : 'from the map'}
          hint="Blank: the ground height at the site from the ITU-R P.1511-1 map."
        />
        {site && <TextAreaField label="Notes (optional)" name="notes" defaultValue={site.notes ?? ''} className="sm:col-span-2 lg:col-span-3" />}
      </div>
      <SaveRow label={site ? 'Save site' : 'Add site'} onCancel={onCancel} />
    </ActionForm>
  );
}
