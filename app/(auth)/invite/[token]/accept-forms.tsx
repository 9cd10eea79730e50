'use client';

import Link from 'next/link';
import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { acceptInvitation, acceptInvitationWithAccount } from '@/server/actions/auth';

/** No account yet for the address: name and password create it. */
export function NewAccountForm({ token, email }: { token: string; email: string }) {
  return (
    <ActionForm action={acceptInvitation} className="grid gap-4" aria-label="Create your account and join">
      <input type="hidden" name="token" value={token} />
      <div>
        <p className="block text-sm font-medium text-stone-800">E-mail address</p>
        <p className="mt-1 rounded border border-stone-200 bg-stone-50 px-3 py-2 text-sm text-stone-700">{email}</p>
        <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      </div>
      <Field label="Your name" name="name" autoComplete="name" required autoFocus />
      <Field label="Choose a password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters. A short sentence works well." required />
      <div>
        <SubmitButton pendingLabel="Joining…">Create account and join</SubmitButton>
      </div>
    </ActionForm>
  );
}

/** The address already has an account: its password proves it is theirs. */
export function ExistingAccountForm({ token, email }: { token: string; email: string }) {
  return (
    <ActionForm action={acceptInvitationWithAccount} className="grid gap-4" aria-label="Sign in and join">
      <input type="hidden" name="token" value={token} />
      <p className="text-sm text-stone-600">You already have a FadeLedger account with this address. Sign in to add this company to it.</p>
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <Field label={`Password for ${email}`} name="password" type="password" autoComplete="current-password" required autoFocus />
      <div className="flex items-center justify-between gap-3">
        <SubmitButton pendingLabel="Joining…">Sign in and join</SubmitButton>
        <Link href="/forgot-password" className="text-sm text-ledger-700 underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      </div>
    </ActionForm>
  );
}

export function JoinSignedInForm({ token }: { token: string }) {
  return (
    <ActionForm action={acceptInvitationWithAccount} className="grid gap-4" aria-label="Join">
      <input type="hidden" name="token" value={token} />
      <div>
        <SubmitButton pendingLabel="Joining…">Join the company</SubmitButton>
      </div>
    </ActionForm>
  );
}
