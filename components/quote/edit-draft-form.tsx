'use client';

import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { ActionForm, useFormState } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { deleteQuote, updateQuote } from '@/server/actions/quotes';
import { TermsFields, type TermsDefaults } from './terms-fields';

/** The draft's customer, validity, prices and notes; a sent quote is never edited. */
export function EditDraftForm({ quoteId, defaults }: { quoteId: number; defaults: TermsDefaults }) {
  return (
    <ActionForm action={updateQuote} aria-label="Edit the draft" className="space-y-6">
      <input type="hidden" name="quoteId" value={quoteId} />
      <TermsFields d={defaults} />
      <SubmitButton pendingLabel="Saving…">Save changes</SubmitButton>
    </ActionForm>
  );
}

/** After deleting, back to the list (the draft's page is gone). */
function BackToList() {
  const state = useFormState();
  const router = useRouter();
  useEffect(() => {
    if (state?.ok) router.push('/quotes');
  }, [state, router]);
  return null;
}

export function DeleteDraftForm({ quoteId }: { quoteId: number }) {
  return (
    <ActionForm action={deleteQuote} aria-label="Delete the draft">
      <input type="hidden" name="quoteId" value={quoteId} />
      <SubmitButton variant="danger" size="sm" pendingLabel="Deleting…">Delete this draft</SubmitButton>
      <BackToList />
    </ActionForm>
  );
}

