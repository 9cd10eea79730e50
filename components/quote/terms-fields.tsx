'use client';

import { Field } from '@/components/ui/field';
import { useFormState } from '@/components/ui/action-form';
import { QUOTE_NOTES_MAX } from '@/server/validation/quote';
import { TotalsPreview } from './totals-preview';

export interface TermsDefaults {
  title: string;
  customerName: string;
  customerEmail: string;
  validUntil: string;
  hardwarePrice: string;
  labourPrice: string;
  extrasLabel: string;
  extrasPrice: string;
  discountAmount: string;
  taxRatePercent: string;
  notes: string;
}

function NotesField({ defaultValue }: { defaultValue: string }) {
  const state = useFormState();
  const errors = state && !state.ok ? (state.fieldErrors?.notes ?? []) : [];
  const echoed = state && !state.ok ? state.values?.notes : undefined;
  return (
    <div>
      <label htmlFor="quote-notes" className="block text-sm font-medium text-stone-800">
        Notes for the customer
      </label>
      <textarea
        id="quote-notes"
        name="notes"
        rows={4}
        maxLength={QUOTE_NOTES_MAX}
        key={echoed ?? 'initial'}
        defaultValue={echoed ?? defaultValue}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={errors.length ? 'quote-notes-error' : 'quote-notes-hint'}
        className="mt-1 block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200"
      />
      {errors.length ? (
        <p id="quote-notes-error" className="mt-1 text-xs text-red-700">{errors.join(' ')}</p>
      ) : (
        <p id="quote-notes-hint" className="mt-1 text-xs text-stone-600">Shown on the customer’s page and the PDF: access, mounting, what is included.</p>
      )}
    </div>
  );
}

/** Customer, validity, prices and notes: the same fields for a new quote and for editing a draft. */
export function TermsFields({ d, priceKey = '' }: { d: TermsDefaults; priceKey?: string }) {
  return (
    <div className="space-y-6">
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-sm font-semibold text-stone-900">Customer</legend>
        <Field label="Customer name" name="customerName" defaultValue={d.customerName} required autoComplete="off" />
        <Field label="Customer e-mail" name="customerEmail" type="email" defaultValue={d.customerEmail} hint="Optional; needed to e-mail the quote." autoComplete="off" />
        <Field label="Quote title" name="title" defaultValue={d.title} hint="Optional; for your list. Defaults to site and dish." />
        <Field label="Valid until" name="validUntil" type="date" defaultValue={d.validUntil} required hint="The customer can accept until the end of this day (UTC)." />
      </fieldset>
      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-stone-900">Prices (USD)</legend>
        <TotalsPreview>
          <div key={priceKey} className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <Field label="Hardware" name="hardwarePrice" inputMode="decimal" defaultValue={d.hardwarePrice} required hint="Dish, LNB and mount. From the catalogue; change it if needed." />
            <Field label="Labour" name="labourPrice" inputMode="decimal" defaultValue={d.labourPrice} required />
            <Field label="Tax rate %" name="taxRatePercent" inputMode="decimal" defaultValue={d.taxRatePercent} hint="0 if prices include tax or none applies." />
            <Field label="Extras" name="extrasPrice" inputMode="decimal" defaultValue={d.extrasPrice} />
            <Field label="Extras description" name="extrasLabel" defaultValue={d.extrasLabel} hint="e.g. cable run, wall bracket" />
            <Field label="Discount" name="discountAmount" inputMode="decimal" defaultValue={d.discountAmount} />
          </div>
        </TotalsPreview>
      </fieldset>
      <NotesField defaultValue={d.notes} />
    </div>
  );
}
