'use client';

import { useState } from 'react';
import { createClimateProfile } from '@/server/actions/climate';
import { climateFormSchema } from '@/server/validation/climate';
import { CLIMATE_ZONES } from '@/server/engine/p837-1-climate-zones';
import { ActionForm, ActionFormStatus } from '@/components/ui/action-form';
import { Field, SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { PlaceFields } from './place-fields';

/**
 * A climate typed in: a known R0.01 or a legacy ITU-R P.837-1 zone (normals and curves come as CSV),
 * with the place it was made for. Profiles override the RAIN climate of a study only.
 */
export function ClimateForm() {
  const [kind, setKind] = useState<'known-r001' | 'climate-zone'>('known-r001');
  return (
    <ActionForm action={createClimateProfile} schema={climateFormSchema} resetOnSuccess status="placed" className="space-y-4" aria-label="Add a climate profile">
      <fieldset>
        <legend className="text-sm font-medium text-stone-800">Kind</legend>
        <div className="mt-1 flex flex-wrap gap-4">
          {(
            [
              ['known-r001', 'Known R0.01'],
              ['climate-zone', 'ITU-R P.837-1 climate zone'],
            ] as const
          ).map(([v, l]) => (
            <label key={v} className="inline-flex items-center gap-1.5 text-sm">
              <input type="radio" name="kind" value={v} checked={kind === v} onChange={() => setKind(v)} className="accent-ledger-700" />
              {l}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid gap-4 md:grid-cols-2">
        <Field label="Name" name="name" />
        {kind === 'known-r001' ? (
          <Field label="R0.01 (mm/h)" name="r001MmH" inputMode="decimal" hint="Rain rate exceeded 0.01 % of an average year, e.g. read off the ITU-R P.837 map." />
        ) : (
          <SelectField label="Zone" name="zone" placeholder="Choose a zone…" options={CLIMATE_ZONES.map((z) => ({ value: z, label: `Zone ${z}` }))} hint="Legacy P.837-1 zones; prefer monthly normals where you have them." />
        )}
        <Field label="Source of the figure" name="sourceNote" placeholder="Where the value comes from" />
        <Field label="0 °C isotherm height (km, optional)" name="zeroIsothermKm" inputMode="decimal" hint="ITU-R P.839-4 h0; blank takes the P.839-4 map value at each study's site." />
        <PlaceFields className="md:col-span-2" />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pendingLabel="Saving…">Add climate profile</SubmitButton>
        <ActionFormStatus />
      </div>
    </ActionForm>
  );
}
