import Link from 'next/link';
import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getAuthContext } from '@/server/auth/guards';
import { findPlanByCode } from '@/db/queries/companies';
import { SIGN_UP_LINK_HOURS, TRIAL_PLAN_CODE } from '@/server/auth/sign-up';
import { AuthCard } from '../auth-card';
import { SignUpForm } from './sign-up-form';

export const metadata: Metadata = { title: 'Start a free trial' };

export default async function SignUpPage() {
  if (await getAuthContext()) redirect('/dashboard');
  const trial = await findPlanByCode(TRIAL_PLAN_CODE);
  const days = trial?.trialDays ?? 14;
  return (
    <AuthCard
      title="Start a free trial"
      intro={
        <>
          A company account for your team, free for {days} days with up to {trial?.seatLimit ?? 5} seats. No card needed. We e-mail you a link to confirm the address; you become the admin and can invite
          installers and sales colleagues.
        </>
      }
      footer={
        <>
          Already have an account?{' '}
          <Link href="/sign-in" className="font-medium text-ledger-700 underline-offset-2 hover:underline">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm linkHours={SIGN_UP_LINK_HOURS} />
    </AuthCard>
  );
}
