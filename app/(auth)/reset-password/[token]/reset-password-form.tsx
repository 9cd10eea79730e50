'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field, FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { resetPassword } from '@/server/actions/auth';

export function ResetPasswordForm({ token, email }: { token: string; email: string }) {
  return (
    <ActionForm action={resetPassword} className="grid gap-4" aria-label="Choose a new password">
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters. A short sentence works well." required autoFocus />
      <Field label="New password again" name="confirm" type="password" autoComplete="new-password" required />
      <FormErrors names={['token']} />
      <div>
        <SubmitButton pendingLabel="Saving…">Save new password</SubmitButton>
      </div>
    </ActionForm>
  );
}
