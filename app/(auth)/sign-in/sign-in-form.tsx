'use client';

import Link from 'next/link';
import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { signIn } from '@/server/actions/auth';

export function SignInForm({ next }: { next?: string }) {
  return (
    <ActionForm action={signIn} className="grid gap-4" aria-label="Sign in">
      {next && <input type="hidden" name="next" value={next} />}
      <Field label="E-mail address" name="email" type="email" autoComplete="username" required autoFocus />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required />
      <div className="flex items-center justify-between gap-3">
        <SubmitButton pendingLabel="Signing in…">Sign in</SubmitButton>
        <Link href="/forgot-password" className="text-sm text-ledger-700 underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      </div>
    </ActionForm>
  );
}
