'use client';

import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { confirmSignUp } from '@/server/actions/auth';

/**
 * One button, not a GET that acts: mail scanners and link previews open links too, and must
 * not spend the link or create the company.
 */
export function ConfirmSignUpForm({ token }: { token: string }) {
  return (
    <ActionForm action={confirmSignUp} className="grid gap-4" aria-label="Finish creating your account">
      <input type="hidden" name="token" value={token} />
      <div>
        <SubmitButton pendingLabel="Creating your account…">Create the company account</SubmitButton>
      </div>
    </ActionForm>
  );
}
