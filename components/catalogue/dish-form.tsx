'use client';

import { createDish, updateDish } from '@/server/actions/catalogue';
import { dishSchema, dishUpdateSchema } from '@/server/validation/dish';
import { Button } from '@/components/ui/button';
import { FormStatus } from '@/components/ui/form-status';
import { TextInput } from '@/components/study/form-fields';
import { useValidatedAction } from '@/components/study/use-validated-action';

export type DishFormValues = { id: number; name: string; diameterM: string; efficiency: string; hardwarePrice: string; labourPrice: string; mountNotes: string | null; active: boolean };

/** Add a dish, or edit one (with `dish`): diameter in metres, efficiency as a fraction, prices in USD. */
export function DishForm({ dish }: { dish?: DishFormValues }) {
  const { state, formAction, pending, onSubmit, onInput, errors, message, failed } = useValidatedAction(dish ? updateDish : createDish, dish ? dishUpdateSchema : dishSchema, { resetOnSuccess: !dish });
  return (
    <form action={formAction} onSubmit={onSubmit} onInput={onInput} noValidate className="space-y-4" aria-label={dish ? `Edit ${dish.name}` : 'Add a dish'}>
      {dish && <input type="hidden" name="id" value={dish.id} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextInput label="Name" name="name" defaultValue={dish?.name} errors={errors.name} className="sm:col-span-2" />
        <TextInput label="Diameter (m)" name="diameterM" inputMode="decimal" defaultValue={dish?.diameterM} placeholder="0.90" errors={errors.diameterM} />
        <TextInput label="Efficiency" name="efficiency" inputMode="decimal" defaultValue={dish?.efficiency ?? '0.65'} hint="Aperture efficiency, 0.2–0.95" errors={errors.efficiency} />
        <TextInput label="Hardware (USD)" name="hardwarePrice" inputMode="decimal" defaultValue={dish?.hardwarePrice} errors={errors.hardwarePrice} />
        <TextInput label="Labour (USD)" name="labourPrice" inputMode="decimal" defaultValue={dish?.labourPrice} errors={errors.labourPrice} />
        <TextInput label="Mount notes" name="mountNotes" defaultValue={dish?.mountNotes ?? ''} errors={errors.mountNotes} className="sm:col-span-2" />
        <label className="flex items-center gap-2 self-end pb-2 text-sm text-stone-800">
          <input type="checkbox" name="active" defaultChecked={dish?.active ?? true} className="accent-ledger-700" /> Offered in new studies
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : dish ? 'Save dish' : 'Add dish'}
        </Button>
        <FormStatus state={failed ? { ok: false, error: message } : state} />
      </div>
    </form>
  );
}
