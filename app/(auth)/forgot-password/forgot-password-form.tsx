'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { requestPasswordReset } from '@/server/actions/auth';

export function ForgotPasswordForm({ defaultEmail }: { defaultEmail?: string }) {
  return (
    <ActionForm action={requestPasswordReset} className="grid gap-4" aria-label="Ask for a reset link">
      <Field label="E-mail address" name="email" type="email" autoComplete="username" defaultValue={defaultEmail} required autoFocus={!defaultEmail} />
      <div>
        <SubmitButton pendingLabel="Sending…">Send reset link</SubmitButton>
      </div>
    </ActionForm>
  );
}
