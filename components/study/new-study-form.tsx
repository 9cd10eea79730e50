'use client';

import { useMemo, useState } from 'react';
import { createStudy, reviseStudy } from '@/server/actions/studies';
import { MAPS_CLIMATE_VALUE, newStudySchema, reviseStudySchema, STUDY_SERVICES, TARGET_AVAILABILITY_PERCENT } from '@/server/validation/study';
import { parseCoordinate, formatDms } from '@/server/validation/coordinates';
import { ActionForm, ActionFormStatus } from '@/components/ui/action-form';
import { Field, FormErrors, SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { NavigateOnSuccess } from '@/components/ui/navigate-on-success';
import { allowedMinutesPerYear, diameterLabel, minutesText } from '@/server/study-option';
import { formatMoney } from '@/server/money-format';
import { greatCircleKm, PROFILE_FAR_FROM_SITE_KM } from '@/server/studies/climate-location';
import { InputChangeList } from './input-change-list';
import { DuplicateCustomerChoice } from '@/components/sites/duplicate-customer-choice';

export type NewStudyOptions = {
  customers: { id: number; name: string }[];
  sites: { id: number; name: string; customerId: number; latDeg: number; lonDeg: number }[];
  services: { id: number; name: string; satelliteName: string; slot: string; frequencyGHz: number }[];
  /** Override profiles of the rain climate; the ITU-R maps at the site are the default (`mapsName`). */
  climates: { id: number; name: string; kindLabel: string; place: string; location: { latDeg: number; lonDeg: number } | null }[];
  mapsName: string;
  dishes: { id: number; name: string; diameterM: number; price: string }[];
};

/** The form opened on a stored study: its choices prefill the boxes, and saving makes its next revision. */
export type StudyEdit = {
  studyId: number;
  /** The revision being edited. */
  fromRevision: number;
  /** The revision the save will make. */
  nextRevision: number;
  initial: {
    customerId: number;
    siteId: number;
    serviceProfileId: number;
    compareServiceProfileIds: number[];
    /** null: the ITU-R maps at the site. */
    climateProfileId: number | null;
    dishIds: number[];
    targetAvailabilityPercent: number;
    title: string;
  };
  /** The stored choices in words (from the snapshot), for the list of changes. */
  before: import('@/server/studies/input-changes').StudyChoiceView;
};

/** Live "= 47.123456° (47° 07′ 24.4″ N)" under a coordinate box, so a DMS typo shows before submitting. */
function CoordinateEcho({ text, axis }: { text: string; axis: 'lat' | 'lon' }) {
  if (!text.trim()) return null;
  const r = parseCoordinate(text, axis);
  return <span className={r.ok ? 'text-stone-600' : 'text-amber-800'}>{r.ok ? `= ${r.value}° (${formatDms(r.value, axis)})` : r.error}</span>;
}

const CLIMATE_HINT = 'Gases, clouds and scintillation always come from the ITU-R maps at the site; a profile replaces the rain climate only.';

/** Under the climate box: how far the chosen override profile was made from the site, before the study is computed. */
function ClimateHint({ profile, site }: { profile: NewStudyOptions['climates'][number] | undefined; site: { latDeg: number; lonDeg: number } | null }) {
  if (!profile) return <>{CLIMATE_HINT}</>;
  if (!profile.location) return <span className="text-amber-800">Made for an unknown place: check that its figures belong to this site. {CLIMATE_HINT}</span>;
  if (!site) return <>{CLIMATE_HINT}</>;
  const km = Math.round(greatCircleKm(site, profile.location));
  const far = km > PROFILE_FAR_FROM_SITE_KM;
  return (
    <span className={far ? 'text-amber-800' : undefined}>
      Made for a place {km.toLocaleString('en-US')} km from this site{far ? ': its rain figures may not describe it' : ''}. {CLIMATE_HINT}
    </span>
  );
}

function Radio({ name, value, checked, onChange, children }: { name: string; value: string; checked: boolean; onChange: (v: string) => void; children: string }) {
  return (
    <label className="inline-flex items-center gap-1.5 text-sm text-stone-800">
      <input type="radio" name={name} value={value} checked={checked} onChange={() => onChange(value)} className="accent-ledger-700" />
      {children}
    </label>
  );
}

/**
 * The new-study form: customer and site (picked, or typed in with decimal or DMS coordinates),
 * service, rain climate, the dishes to compare and the target availability. Checked in the
 * browser with the same zod schema the server action uses; on success it opens the result.
 */
export function NewStudyForm({ options, preset, edit }: { options: NewStudyOptions; preset?: { customerId?: number; siteId?: number }; edit?: StudyEdit }) {
  const initial = edit?.initial;
  const [customerMode, setCustomerMode] = useState<'existing' | 'new'>(options.customers.length ? 'existing' : 'new');
  const [siteMode, setSiteMode] = useState<'existing' | 'new'>(options.sites.length ? 'existing' : 'new');
  const [customerId, setCustomerId] = useState(initial?.customerId ? String(initial.customerId) : preset?.customerId ? String(preset.customerId) : '');
  const [siteId, setSiteId] = useState(initial?.siteId ? String(initial.siteId) : preset?.siteId ? String(preset.siteId) : '');
  const [lat, setLat] = useState('');
  const [lon, setLon] = useState('');
  const [climateId, setClimateId] = useState<string>(initial?.climateProfileId ? String(initial.climateProfileId) : MAPS_CLIMATE_VALUE);
  const [serviceId, setServiceId] = useState(initial?.serviceProfileId ? String(initial.serviceProfileId) : '');

  const sitesOfCustomer = useMemo(() => options.sites.filter((s) => String(s.customerId) === customerId), [options.sites, customerId]);
  const pickingCustomer = customerMode === 'existing' && customerId === '';
  const showSiteChoice = customerMode === 'existing' && !pickingCustomer && sitesOfCustomer.length > 0;
  const newSite = !pickingCustomer && (customerMode === 'new' || siteMode === 'new' || sitesOfCustomer.length === 0);
  // Where the study's site is, as far as the form knows yet: typed coordinates, or the picked site's.
  const typedLat = parseCoordinate(lat, 'lat');
  const typedLon = parseCoordinate(lon, 'lon');
  const picked = options.sites.find((s) => String(s.id) === siteId);
  const siteAt = newSite ? (typedLat.ok && typedLon.ok ? { latDeg: typedLat.value, lonDeg: typedLon.value } : null) : picked ? { latDeg: picked.latDeg, lonDeg: picked.lonDeg } : null;

  return (
    <ActionForm
      action={edit ? reviseStudy : createStudy}
      schema={edit ? reviseStudySchema : newStudySchema}
      status="placed"
      className="space-y-8"
      aria-label={edit ? `Edit inputs of study ${edit.studyId}` : 'New study'}
    >
      <NavigateOnSuccess base="/studies/" />
      {edit && <input type="hidden" name="revisionOfStudyId" value={edit.studyId} />}
      <fieldset className="space-y-4">
        <legend className="text-base font-semibold text-stone-900">Customer and site</legend>
        <div className="flex flex-wrap gap-4" role="radiogroup" aria-label="Customer">
          <Radio name="customerMode" value="existing" checked={customerMode === 'existing'} onChange={(v) => setCustomerMode(v as 'existing')}>
            Existing customer
          </Radio>
          <Radio name="customerMode" value="new" checked={customerMode === 'new'} onChange={(v) => setCustomerMode(v as 'new')}>
            New customer
          </Radio>
        </div>
        {customerMode === 'existing' ? (
          <SelectField
            label="Customer"
            name="customerId"
            value={customerId}
            onChange={(e) => {
              setCustomerId(e.target.value);
              setSiteId('');
            }}
            placeholder="Choose a customer…"
            options={options.customers.map((c) => ({ value: String(c.id), label: c.name }))}
            className="max-w-md"
          />
        ) : (
          <>
            <Field label="Customer name" name="newCustomerName" autoComplete="off" className="max-w-md" />
            <DuplicateCustomerChoice useExisting="To use the existing customer, choose “Existing customer” above and pick it from the list." />
          </>
        )}

        {showSiteChoice && (
          <div className="flex flex-wrap gap-4" role="radiogroup" aria-label="Site">
            <Radio name="siteMode" value="existing" checked={siteMode === 'existing'} onChange={(v) => setSiteMode(v as 'existing')}>
              Existing site
            </Radio>
            <Radio name="siteMode" value="new" checked={siteMode === 'new'} onChange={(v) => setSiteMode(v as 'new')}>
              New site
            </Radio>
          </div>
        )}
        {newSite ? (
          <>
            {!showSiteChoice && <input type="hidden" name="siteMode" value="new" />}
            {customerMode === 'existing' && sitesOfCustomer.length === 0 && <p className="text-sm text-stone-600">This customer has no site yet: add it here.</p>}
            <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
              <Field label="Site name" name="siteName" autoComplete="off" className="lg:col-span-1" />
              <Field
                label="Latitude"
                name="latDeg"
                value={lat}
                onChange={(e) => setLat(e.target.value)}
                placeholder={`47.1234 or 47°07'24"N`}
                autoComplete="off"
                hint={<CoordinateEcho text={lat} axis="lat" />}
              />
              <Field
                label="Longitude"
                name="lonDeg"
                value={lon}
                onChange={(e) => setLon(e.target.value)}
                placeholder={`2.654 or 2°39'15"E`}
                autoComplete="off"
                hint={<CoordinateEcho text={lon} axis="lon" />}
              />
              <Field
                label="Altitude (m above sea level)"
                name="altitudeM"
                inputMode="decimal"
                placeholder="from the map"
                hint="Blank: the ground height at the site from the ITU-R P.1511-1 map."
              />
            </div>
            <p className="text-xs text-stone-600">Decimal degrees (north and east positive) or degrees, minutes and seconds with N/S/E/W.</p>
          </>
        ) : (
          <SelectField
            label="Site"
            name="siteId"
            value={siteId}
            disabled={pickingCustomer}
            onChange={(e) => setSiteId(e.target.value)}
            placeholder={pickingCustomer ? 'Choose a customer first' : 'Choose a site…'}
            options={sitesOfCustomer.map((s) => ({ value: String(s.id), label: s.name }))}
            className="max-w-md"
          />
        )}
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-4 text-base font-semibold text-stone-900">Service and rain climate</legend>
        <SelectField
          label="Satellite service"
          name="serviceProfileId"
          value={serviceId}
          onChange={(e) => setServiceId(e.target.value)}
          placeholder="Choose a service…"
          options={options.services.map((s) => ({ value: String(s.id), label: `${s.name} — ${s.satelliteName} at ${s.slot}, ${s.frequencyGHz} GHz` }))}
        />
        <SelectField
          label="Rain climate"
          name="climateProfileId"
          value={climateId}
          onChange={(e) => setClimateId(e.target.value)}
          options={[
            { value: MAPS_CLIMATE_VALUE, label: options.mapsName },
            ...options.climates.map((c) => ({ value: String(c.id), label: `${c.name} (${c.kindLabel}; made for ${c.place})` })),
          ]}
          hint={<ClimateHint profile={options.climates.find((c) => String(c.id) === climateId)} site={siteAt} />}
        />
      </fieldset>

      {options.services.length > 1 && (
        <fieldset aria-describedby="compare-services-error">
          <legend className="text-base font-semibold text-stone-900">Compare with other services (optional)</legend>
          <p className="mt-1 text-sm text-stone-600">
            Each service ticked here is computed for the same site, climate, dishes and target, with its own table; the study then names the smallest dish that
            meets every service&rsquo;s target. Up to {STUDY_SERVICES.max - 1}.
          </p>
          <ul className="mt-3 grid gap-2 sm:grid-cols-2">
            {options.services.map((s) => {
              const main = String(s.id) === serviceId;
              return (
                <li key={s.id}>
                  <label className="flex items-center gap-2 rounded border border-stone-200 bg-white px-3 py-2 text-sm has-[:checked]:border-ledger-500 has-[:checked]:bg-ledger-50 has-[:disabled]:opacity-60">
                    <input
                      type="checkbox"
                      name="compareServiceProfileIds"
                      value={s.id}
                      disabled={main}
                      defaultChecked={initial?.compareServiceProfileIds.includes(s.id)}
                      className="accent-ledger-700"
                    />
                    <span className="min-w-0 flex-1">
                      <span className="block font-medium text-stone-900">{s.name}</span>
                      <span className="block text-xs text-stone-600">{main ? 'the main service above' : `${s.satelliteName} at ${s.slot}, ${s.frequencyGHz} GHz`}</span>
                    </span>
                  </label>
                </li>
              );
            })}
          </ul>
          <div className="mt-2">
            <FormErrors names={['compareServiceProfileIds']} id="compare-services-error" />
          </div>
        </fieldset>
      )}

      <fieldset aria-describedby="dishes-error">
        <legend className="text-base font-semibold text-stone-900">Dishes to compare</legend>
        <p className="mt-1 text-sm text-stone-600">Active dishes of your catalogue; prices are copied into the study so it never changes afterwards.</p>
        {options.dishes.length === 0 ? (
          <p className="mt-3 text-sm text-amber-800">The catalogue has no active dish yet. An admin adds dishes under Dishes.</p>
        ) : (
          <ul className="mt-3 grid gap-2 sm:grid-cols-2 lg:grid-cols-4">
            {options.dishes.map((d) => {
              const size = diameterLabel(d.diameterM);
              return (
                <li key={d.id}>
                  <label className="flex items-center gap-2 rounded border border-stone-200 bg-white px-3 py-2 text-sm has-[:checked]:border-ledger-500 has-[:checked]:bg-ledger-50">
                    <input type="checkbox" name="dishIds" value={d.id} defaultChecked={initial ? initial.dishIds.includes(d.id) : true} className="accent-ledger-700" />
                    <span className="min-w-0 flex-1">
                      <span className="block font-medium text-stone-900">{d.name}</span>
                      <span className="num block text-left text-xs text-stone-600">
                        {size.words} · {formatMoney(d.price)}
                      </span>
                    </span>
                  </label>
                </li>
              );
            })}
          </ul>
        )}
        <div className="mt-2">
          <FormErrors names={['dishIds']} id="dishes-error" />
        </div>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-4 text-base font-semibold text-stone-900">Target and title</legend>
        <Field
          label="Target availability (%)"
          name="targetAvailabilityPercent"
          inputMode="decimal"
          defaultValue={String(initial?.targetAvailabilityPercent ?? TARGET_AVAILABILITY_PERCENT.default)}
          hint={`Between ${TARGET_AVAILABILITY_PERCENT.min} and ${TARGET_AVAILABILITY_PERCENT.max} %. 99.9 % allows ${minutesText(allowedMinutesPerYear(99.9) ?? 0, 'down')} of outage a year.`}
        />
        <Field label="Title (optional)" name="title" placeholder="Customer · site · service" defaultValue={initial?.title} />
      </fieldset>

      {edit && <InputChangeList edit={edit} options={options} />}
      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton pendingLabel="Computing…">{edit ? `Save as revision ${edit.nextRevision}` : 'Compute study'}</SubmitButton>
        <ActionFormStatus />
      </div>
    </ActionForm>
  );
}
