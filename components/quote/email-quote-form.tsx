'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field, SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { emailQuote } from '@/server/actions/share-links';
import { LINK_DAYS_OPTIONS } from './links-panel';

/** E-mail the quote to the customer with a fresh comparison link. */
export function EmailQuoteForm({ quoteId, customerEmail }: { quoteId: number; customerEmail: string | null }) {
  return (
    <ActionForm action={emailQuote} aria-label="E-mail the quote" className="space-y-3">
      <input type="hidden" name="quoteId" value={quoteId} />
      <div className="grid gap-3">
        <Field label="Send to" name="to" type="email" defaultValue={customerEmail ?? ''} autoComplete="off" hint={customerEmail ? undefined : 'The quote has no customer e-mail yet.'} />
        <SelectField label="Link works for" name="expiresInDays" defaultValue="30" options={LINK_DAYS_OPTIONS} />
      </div>
      <div>
        <label htmlFor="email-message" className="block text-sm font-medium text-stone-800">Personal message (optional)</label>
        <textarea id="email-message" name="message" rows={3} maxLength={2000} className="mt-1 block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200" />
      </div>
      <SubmitButton pendingLabel="Sending…">E-mail the quote</SubmitButton>
    </ActionForm>
  );
}
