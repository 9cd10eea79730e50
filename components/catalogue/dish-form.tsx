'use client';

import { createDish, updateDish } from '@/server/actions/catalogue';
import { dishSchema, dishUpdateSchema } from '@/server/validation/dish';
import { ActionForm, ActionFormStatus } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';

export type DishFormValues = { id: number; name: string; diameterM: string; efficiency: string; hardwarePrice: string; labourPrice: string; mountNotes: string | null; active: boolean };

/** Add a dish, or edit one (with `dish`): diameter in metres, efficiency as a fraction, prices in USD. */
export function DishForm({ dish }: { dish?: DishFormValues }) {
  return (
    <ActionForm action={dish ? updateDish : createDish} schema={dish ? dishUpdateSchema : dishSchema} resetOnSuccess={!dish} status="placed" className="space-y-4" aria-label={dish ? `Edit ${dish.name}` : 'Add a dish'}>
      {dish && <input type="hidden" name="id" value={dish.id} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Name" name="name" defaultValue={dish?.name} className="sm:col-span-2" />
        <Field label="Diameter (m)" name="diameterM" inputMode="decimal" defaultValue={dish?.diameterM} placeholder="0.90" />
        <Field label="Efficiency" name="efficiency" inputMode="decimal" defaultValue={dish?.efficiency ?? '0.65'} hint="Aperture efficiency, 0.2–0.95" />
        <Field label="Hardware (USD)" name="hardwarePrice" inputMode="decimal" defaultValue={dish?.hardwarePrice} />
        <Field label="Labour (USD)" name="labourPrice" inputMode="decimal" defaultValue={dish?.labourPrice} />
        <Field label="Mount notes" name="mountNotes" defaultValue={dish?.mountNotes ?? ''} className="sm:col-span-2" />
        <label className="flex items-center gap-2 self-end pb-2 text-sm text-stone-800">
          <input type="checkbox" name="active" defaultChecked={dish?.active ?? true} className="accent-ledger-700" /> Offered in new studies
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pendingLabel="Saving…">{dish ? 'Save dish' : 'Add dish'}</SubmitButton>
        <ActionFormStatus />
      </div>
    </ActionForm>
  );
}
