'use client';

import { useState } from 'react';
import { createServiceProfile, updateServiceProfile } from '@/server/actions/services';
import { MODCOD_NAMES, POLARIZATION_CHOICES, serviceProfileSchema, serviceProfileUpdateSchema } from '@/server/validation/service-profile';
import { ActionForm, ActionFormStatus } from '@/components/ui/action-form';
import { Field, SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';

export type ServiceFormValues = Record<string, string> & { id: string };

const MODCOD_OPTIONS = MODCOD_NAMES.map((m) => ({ value: m, label: m }));

/** A satellite service: the carrier the dishes must receive (and, for two-way terminals, send). */
export function ServiceForm({ values }: { values?: ServiceFormValues }) {
  const edit = values !== undefined;
  const [uplink, setUplink] = useState(values?.uplinkEnabled === 'on');
  const v = (k: string, d = '') => values?.[k] ?? d;
  return (
    <ActionForm action={edit ? updateServiceProfile : createServiceProfile} schema={edit ? serviceProfileUpdateSchema : serviceProfileSchema} resetOnSuccess={!edit} status="placed" className="space-y-5" aria-label={edit ? `Edit ${values.name}` : 'Add a service'}>
      {edit && <input type="hidden" name="id" value={values.id} />}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field label="Service name" name="name" defaultValue={v('name')} className="lg:col-span-2" />
        <Field label="Satellite" name="satelliteName" defaultValue={v('satelliteName')} />
        <Field label="Orbital position" name="satelliteLongitudeDeg" defaultValue={v('satelliteLongitudeDeg')} placeholder="19.5 W or -19.5" hint="Degrees east; W or a minus sign for west." />
        <Field label="Downlink frequency (GHz)" name="downlinkFrequencyGHz" inputMode="decimal" defaultValue={v('downlinkFrequencyGHz')} />
        <SelectField label="Polarization" name="polarization" defaultValue={v('polarization', 'linear-horizontal')} options={POLARIZATION_CHOICES} />
        <Field label="Polarization tilt offset (°)" name="polarizationTiltDeg" inputMode="decimal" defaultValue={v('polarizationTiltDeg', '0')} hint="Added to the skew; linear only." />
        <Field label="EIRP at the site (dBW)" name="eirpDbw" inputMode="decimal" defaultValue={v('eirpDbw')} />
        <Field label="Symbol rate (Msps)" name="symbolRateMsps" inputMode="decimal" defaultValue={v('symbolRateMsps')} />
        <SelectField label="MODCOD (DVB-S2)" name="modcod" defaultValue={v('modcod')} placeholder="— none, Es/N0 given —" options={MODCOD_OPTIONS} />
        <Field label="Required Es/N0 (dB)" name="requiredEsN0Db" inputMode="decimal" defaultValue={v('requiredEsN0Db')} hint="Blank: the MODCOD's ideal threshold." />
        <Field label="Implementation margin (dB)" name="implementationMarginDb" inputMode="decimal" defaultValue={v('implementationMarginDb', '1')} />
        <Field label="Other losses (dB)" name="otherLossesDb" inputMode="decimal" defaultValue={v('otherLossesDb', '0.3')} hint="Gases, radome, wet feed…" />
        <Field label="LNB noise temperature (K)" name="lnbNoiseTempK" inputMode="decimal" defaultValue={v('lnbNoiseTempK', '60')} />
        <Field label="Antenna noise temperature (K)" name="antennaNoiseTempK" inputMode="decimal" defaultValue={v('antennaNoiseTempK', '40')} />
        <Field label="ACM MODCOD set (optional)" name="acmModcods" defaultValue={v('acmModcods')} placeholder="QPSK 1/2, QPSK 3/4, 8PSK 2/3" className="sm:col-span-2" />
      </div>
      <fieldset className="rounded-md border border-stone-200 px-4 py-3">
        <legend className="px-1 text-sm font-medium text-stone-800">
          <label className="inline-flex items-center gap-2">
            <input type="checkbox" name="uplinkEnabled" checked={uplink} onChange={(e) => setUplink(e.target.checked)} className="accent-ledger-700" /> Two-way service (the terminal transmits)
          </label>
        </legend>
        {uplink && (
          <div className="mt-2 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            <Field label="Uplink frequency (GHz)" name="uplinkFrequencyGHz" inputMode="decimal" defaultValue={v('uplinkFrequencyGHz')} />
            <Field label="HPA (BUC) power (W)" name="uplinkHpaPowerW" inputMode="decimal" defaultValue={v('uplinkHpaPowerW')} hint="EIRP then follows each dish's gain." />
            <Field label="…or fixed terminal EIRP (dBW)" name="uplinkTerminalEirpDbw" inputMode="decimal" defaultValue={v('uplinkTerminalEirpDbw')} />
            <Field label="Satellite G/T (dB/K)" name="uplinkSatelliteGOverTDbK" inputMode="decimal" defaultValue={v('uplinkSatelliteGOverTDbK')} />
            <Field label="Uplink symbol rate (Msps)" name="uplinkSymbolRateMsps" inputMode="decimal" defaultValue={v('uplinkSymbolRateMsps')} />
            <SelectField label="Uplink MODCOD" name="uplinkModcod" defaultValue={v('uplinkModcod')} placeholder="— none, Es/N0 given —" options={MODCOD_OPTIONS} />
            <Field label="Uplink required Es/N0 (dB)" name="uplinkRequiredEsN0Db" inputMode="decimal" defaultValue={v('uplinkRequiredEsN0Db')} />
            <Field label="Uplink implementation margin (dB)" name="uplinkImplementationMarginDb" inputMode="decimal" defaultValue={v('uplinkImplementationMarginDb', '1')} />
          </div>
        )}
      </fieldset>
      <Field label="Notes" name="notes" defaultValue={v('notes')} />
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pendingLabel="Saving…">{edit ? 'Save service' : 'Add service'}</SubmitButton>
        <ActionFormStatus />
      </div>
    </ActionForm>
  );
}
