'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { ConfirmSubmit } from '@/components/team/confirm-submit';
import { changePassword, revokeSession, signOutEverywhere } from '@/server/actions/security';

export function RevokeSessionForm({ digest, current }: { digest: string; current: boolean }) {
  return (
    <ActionForm action={revokeSession} className="flex flex-col items-end" statusClassName="text-xs">
      <input type="hidden" name="session" value={digest} />
      <SubmitButton variant="quiet" size="sm" aria-label={current ? 'Sign out here' : 'Sign out that device'}>
        Sign out
      </SubmitButton>
    </ActionForm>
  );
}

export function SignOutEverywhereForm() {
  return (
    <ActionForm action={signOutEverywhere} className="flex flex-col items-end" statusClassName="text-xs">
      <ConfirmSubmit label="Sign out everywhere" question="Including this device?" confirmLabel="Sign out everywhere" />
    </ActionForm>
  );
}

export function ChangePasswordForm({ email }: { email: string }) {
  return (
    <ActionForm action={changePassword} resetOnSuccess className="grid max-w-md gap-3" aria-label="Change password">
      {/* For password managers: which account this is. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <Field label="Current password" name="current" type="password" autoComplete="current-password" required />
      <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters. A short sentence works well." required />
      <Field label="New password again" name="confirm" type="password" autoComplete="new-password" required />
      <div>
        <SubmitButton pendingLabel="Saving…">Change password</SubmitButton>
      </div>
    </ActionForm>
  );
}
