'use client';

import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { ActionForm, useFormState } from '@/components/ui/action-form';
import { Field, FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { decideQuote } from '@/server/actions/customer-decision';
import { markDecisionRecorded } from './decision-confirmation';

/** After the answer is recorded, re-read the page: the confirmation takes the form's place and the focus. */
function RefreshOnDecision() {
  const state = useFormState();
  const router = useRouter();
  useEffect(() => {
    if (!state?.ok) return;
    markDecisionRecorded();
    router.refresh();
  }, [state, router]);
  return null;
}

/** The customer's answer: their name, an optional address for a receipt, and accept (with a confirmation box) or decline. */
export function CustomerDecisionForm({ token, total, companyName }: { token: string; total: string; companyName: string }) {
  return (
    <ActionForm action={decideQuote} aria-label="Your decision" className="space-y-4">
      <input type="hidden" name="token" value={token} />
      <Field label="Your full name" name="name" autoComplete="name" required className="max-w-md" />
      <Field
        label="E-mail for a receipt (optional)"
        name="receiptEmail"
        type="email"
        autoComplete="email"
        inputMode="email"
        hint={`We send a copy of your answer and the quote to this address. ${companyName} also gets your answer.`}
        className="max-w-md"
      />
      <div>
        <label htmlFor="decision-comment" className="block text-sm font-medium text-stone-800">Comment for {companyName} (optional)</label>
        <textarea id="decision-comment" name="comment" rows={2} maxLength={1000} className="mt-1 block w-full max-w-xl rounded border border-stone-300 bg-white px-3 py-2 text-sm focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200" />
      </div>
      <label className="flex max-w-xl items-start gap-2 text-sm text-stone-800">
        <input type="checkbox" name="confirm" className="mt-0.5 accent-ledger-700" aria-describedby="confirm-hint" />
        <span id="confirm-hint">To accept: I accept this quote for {total}, and understand the outage figures are statistical predictions, not guarantees.</span>
      </label>
      <FormErrors names={['confirm', 'token', 'decision']} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton name="decision" value="accept" pendingLabel="Recording…">Accept the quote</SubmitButton>
        <SubmitButton name="decision" value="decline" variant="secondary" pendingLabel="Recording…">Decline</SubmitButton>
      </div>
      <RefreshOnDecision />
    </ActionForm>
  );
}
