'use client';

import { useState } from 'react';
import { formatDms, parseCoordinate } from '@/server/validation/coordinates';
import { Field } from '@/components/ui/field';

function Echo({ text, axis }: { text: string; axis: 'lat' | 'lon' }) {
  if (!text.trim()) return <>Optional; decimal degrees or DMS, e.g. {axis === 'lat' ? `49°06'N` : `22°25'W`}</>;
  const r = parseCoordinate(text, axis);
  return <span className={r.ok ? '' : 'text-amber-800'}>{r.ok ? `= ${r.value}° (${formatDms(r.value, axis)})` : r.error}</span>;
}

/**
 * Where a climate profile's figures were measured or made for (both boxes or neither). Studies
 * that use the profile at a site more than 100 km away, or with no place given, show a warning.
 */
export function PlaceFields({ className = '' }: { className?: string }) {
  const [lat, setLat] = useState('');
  const [lon, setLon] = useState('');
  return (
    <fieldset className={`grid gap-4 sm:grid-cols-2 ${className}`}>
      <legend className="text-sm font-medium text-stone-800">Place the figures were measured or made for</legend>
      <p className="-mt-2 text-xs text-stone-600 sm:col-span-2">Studies at sites more than 100 km from it, or with no place given, warn that the profile was made for somewhere else.</p>
      <Field label="Latitude of the place" name="latDeg" value={lat} onChange={(e) => setLat(e.target.value)} autoComplete="off" hint={<Echo text={lat} axis="lat" />} />
      <Field label="Longitude of the place" name="lonDeg" value={lon} onChange={(e) => setLon(e.target.value)} autoComplete="off" hint={<Echo text={lon} axis="lon" />} />
    </fieldset>
  );
}
