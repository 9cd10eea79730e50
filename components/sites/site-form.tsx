'use client';

import { useState } from 'react';
import { createSite } from '@/server/actions/sites';
import { siteSchema } from '@/server/validation/site';
import { formatDms, parseCoordinate } from '@/server/validation/coordinates';
import { Button } from '@/components/ui/button';
import { FormStatus } from '@/components/ui/form-status';
import { SelectInput, TextInput } from '@/components/study/form-fields';
import { useValidatedAction } from '@/components/study/use-validated-action';

function Echo({ text, axis }: { text: string; axis: 'lat' | 'lon' }) {
  if (!text.trim()) return <>Decimal degrees or DMS, e.g. {axis === 'lat' ? `47°07'24"N` : `2°39'15"E`}</>;
  const r = parseCoordinate(text, axis);
  return <span className={r.ok ? '' : 'text-amber-800'}>{r.ok ? `= ${r.value}° (${formatDms(r.value, axis)})` : r.error}</span>;
}

/** A new site for a customer; coordinates in decimal degrees or degrees-minutes-seconds. */
export function SiteForm({ customers }: { customers: { id: number; name: string }[] }) {
  const { state, formAction, pending, onSubmit, onInput, errors, message, failed } = useValidatedAction(createSite, siteSchema);
  const [lat, setLat] = useState('');
  const [lon, setLon] = useState('');
  return (
    <form action={formAction} onSubmit={onSubmit} onInput={onInput} noValidate className="space-y-4" aria-label="Add a site">
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <SelectInput label="Customer" name="customerId" placeholder="Choose a customer…" options={customers.map((c) => ({ value: String(c.id), label: c.name }))} errors={errors.customerId} />
        <TextInput label="Site name" name="name" errors={errors.name} />
        <TextInput label="Address (optional)" name="address" errors={errors.address} />
        <TextInput label="Latitude" name="latDeg" value={lat} onChange={(e) => setLat(e.target.value)} autoComplete="off" hint={<Echo text={lat} axis="lat" />} errors={errors.latDeg} />
        <TextInput label="Longitude" name="lonDeg" value={lon} onChange={(e) => setLon(e.target.value)} autoComplete="off" hint={<Echo text={lon} axis="lon" />} errors={errors.lonDeg} />
        <TextInput label="Altitude (m above sea level)" name="altitudeM" inputMode="decimal" defaultValue="0" errors={errors.altitudeM} />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Add site'}
        </Button>
        <FormStatus state={failed ? { ok: false, error: message } : state} />
      </div>
    </form>
  );
}
