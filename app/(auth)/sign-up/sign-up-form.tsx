'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { signUp } from '@/server/actions/auth';

export function SignUpForm() {
  return (
    <ActionForm action={signUp} className="grid gap-4" aria-label="Create your company account">
      <Field label="Your name" name="name" autoComplete="name" required autoFocus />
      <Field label="Company name" name="companyName" autoComplete="organization" hint="As your customers know it; it appears on quotes." required />
      <Field label="Work e-mail address" name="email" type="email" autoComplete="email" required />
      <Field label="Password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters. A short sentence works well." required />
      <div>
        <SubmitButton pendingLabel="Creating your account…">Create account</SubmitButton>
      </div>
    </ActionForm>
  );
}
