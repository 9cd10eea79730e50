'use client';

import { useActionState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';
import { createPlanAction, updatePlanAction } from '@/server/actions/plans';

export type PlanFormValues = {
  id?: number;
  code: string;
  kind: 'paid' | 'free' | 'trial';
  name: string;
  description: string;
  monthlyPriceUsd: string;
  seatLimit: number;
  studiesPerMonth: number;
  activeLinksLimit: number;
  uploadsPerMonth: number;
  campaignSitesLimit: number;
  apiAccess: boolean;
  quoteBranding: boolean;
  isPublic: boolean;
  sortOrder: number;
  trialDays: number | null;
};

function Field({ name, label, hint, errors, children }: { name: string; label: string; hint?: string; errors?: string[]; children: React.ReactNode }) {
  return (
    <div>
      <label htmlFor={name} className="block text-sm font-medium text-stone-800">{label}</label>
      {children}
      {hint && <p className="mt-0.5 text-xs text-stone-500">{hint}</p>}
      {errors?.map((e) => <p key={e} id={`${name}-error`} className="mt-0.5 text-xs text-red-700">{e}</p>)}
    </div>
  );
}

const input = 'mt-1 block w-full rounded border border-stone-300 bg-white px-2 py-1.5 text-sm focus:border-ledger-600';

/** The staff plan form; saving also pushes product and price to the payment provider. */
export function PlanForm({ initial }: { initial: PlanFormValues }) {
  const editing = initial.id !== undefined;
  const [state, formAction] = useActionState<ActionState<{ planId: number }> | null, FormData>(editing ? updatePlanAction : createPlanAction, null);
  const fe = state && !state.ok ? state.fieldErrors ?? {} : {};
  const v = (k: keyof PlanFormValues) => (state && !state.ok && state.values?.[k] !== undefined ? state.values[k] : String(initial[k] ?? ''));
  const num = (name: keyof PlanFormValues, label: string, hint?: string) => (
    <Field name={name} label={label} hint={hint} errors={fe[name]}>
      <input id={name} name={name} type="number" min={0} step={1} inputMode="numeric" defaultValue={v(name)} className={`${input} num`} aria-invalid={fe[name] ? true : undefined} aria-describedby={fe[name] ? `${name}-error` : undefined} />
    </Field>
  );
  const check = (name: keyof PlanFormValues, label: string) => (
    <label className="flex items-center gap-2 text-sm text-stone-800">
      <input type="checkbox" name={name} defaultChecked={Boolean(initial[name])} className="h-4 w-4 accent-ledger-700" />
      {label}
    </label>
  );
  return (
    <form action={formAction} className="space-y-5" noValidate>
      {editing && <input type="hidden" name="id" value={initial.id} />}
      <div className="grid gap-4 sm:grid-cols-2">
        {editing ? (
          <div className="text-sm"><span className="font-medium text-stone-800">Code and kind</span><p className="mt-1 font-mono text-stone-700">{initial.code} · {initial.kind}</p></div>
        ) : (
          <>
            <Field name="code" label="Code" hint="Lower-case, fixed once created (e.g. crew-plus)." errors={fe.code}>
              <input id="code" name="code" defaultValue={v('code')} className={`${input} font-mono`} autoComplete="off" />
            </Field>
            <Field name="kind" label="Kind" errors={fe.kind}>
              <select id="kind" name="kind" defaultValue={v('kind')} className={input}>
                <option value="paid">Paid (sold monthly)</option>
                <option value="free">Free tier</option>
                <option value="trial">Trial</option>
              </select>
            </Field>
          </>
        )}
        <Field name="name" label="Name" errors={fe.name}>
          <input id="name" name="name" defaultValue={v('name')} className={input} />
        </Field>
        <Field name="monthlyPriceUsd" label="Monthly price (USD)" hint="A new amount creates a new price at the provider; the old price is archived." errors={fe.monthlyPriceUsd}>
          <input id="monthlyPriceUsd" name="monthlyPriceUsd" inputMode="decimal" defaultValue={v('monthlyPriceUsd')} className={`${input} num`} />
        </Field>
      </div>
      <Field name="description" label="Description" errors={fe.description}>
        <textarea id="description" name="description" rows={2} defaultValue={v('description')} className={input} />
      </Field>
      <fieldset className="grid gap-4 sm:grid-cols-4">
        <legend className="mb-2 text-sm font-semibold text-stone-900">Limits</legend>
        {num('seatLimit', 'Seats', 'members + pending invitations')}
        {num('studiesPerMonth', 'Studies / month')}
        {num('activeLinksLimit', 'Active links')}
        {num('uploadsPerMonth', 'Uploads / month')}
        {num('campaignSitesLimit', 'Sites / campaign', 'in one upgrade campaign file; 0 turns campaigns off')}
      </fieldset>
      <div className="flex flex-wrap gap-x-6 gap-y-2">
        {check('apiAccess', 'Trade-off API')}
        {check('quoteBranding', 'Quote branding')}
        {check('isPublic', 'Listed on the pricing page and plan picker')}
      </div>
      <div className="grid gap-4 sm:grid-cols-4">
        {num('sortOrder', 'Display order')}
        <Field name="trialDays" label="Trial days" hint="Trial plans only." errors={fe.trialDays}>
          <input id="trialDays" name="trialDays" type="number" min={1} max={90} defaultValue={v('trialDays')} className={`${input} num`} />
        </Field>
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton pendingLabel="Saving and syncing…">{editing ? 'Save and sync' : 'Create and sync'}</SubmitButton>
        <FormStatus state={state} />
      </div>
    </form>
  );
}
