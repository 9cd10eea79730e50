'use client';

import { ActionForm, useFormState } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { signUp } from '@/server/actions/auth';

export function SignUpForm({ linkHours }: { linkHours: number }) {
  return (
    <ActionForm action={signUp} className="grid gap-4" statusClassName="order-first text-base font-medium" aria-label="Create your company account">
      <SignUpFields linkHours={linkHours} />
    </ActionForm>
  );
}

/** Once the form is sent, the fields give way to what happens next (the status line says where the mail went). */
function SignUpFields({ linkHours }: { linkHours: number }) {
  const state = useFormState();
  if (state?.ok) {
    return (
      <div className="grid gap-2 text-sm text-stone-600">
        <p>
          The link in that message works once, within {linkHours} hours. Nothing is created until you open it. No message after a few minutes? Look in the spam folder, or{' '}
          <button type="button" className="font-medium text-ledger-700 underline-offset-2 hover:underline" onClick={() => window.location.reload()}>
            fill in the form again
          </button>
          .
        </p>
      </div>
    );
  }
  return (
    <>
      <Field label="Your name" name="name" autoComplete="name" required autoFocus />
      <Field label="Company name" name="companyName" autoComplete="organization" hint="As your customers know it; it appears on quotes." required />
      <Field label="Work e-mail address" name="email" type="email" autoComplete="email" required />
      <Field label="Password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters. A short sentence works well." required />
      <div>
        <SubmitButton pendingLabel="Sending…">Create account</SubmitButton>
      </div>
    </>
  );
}
