import Link from 'next/link';
import type { Metadata } from 'next';
import { Notice } from '@/components/ui/notice';
import { LinkButton } from '@/components/ui/button';
import { inspectSignUpLink, SIGN_UP_LINK_DEAD, TRIAL_PLAN_CODE } from '@/server/auth/sign-up';
import { looksLikeToken } from '@/server/auth/tokens';
import { findPlanByCode } from '@/db/queries/companies';
import { AuthCard } from '../../../auth-card';
import { ConfirmSignUpForm } from './confirm-form';

// The token is in the path: keep it out of Referer headers sent to anything the page loads.
export const metadata: Metadata = { title: 'Finish creating your account', referrer: 'no-referrer', robots: { index: false, follow: false } };

const linkClass = 'font-medium text-ledger-700 underline-offset-2 hover:underline';

export default async function ConfirmSignUpPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = looksLikeToken(token) ? await inspectSignUpLink(token) : ({ state: 'dead', message: SIGN_UP_LINK_DEAD } as const);
  if (link.state !== 'valid') {
    return (
      <AuthCard
        title="This link no longer works"
        footer={
          <>
            Already have an account?{' '}
            <Link href="/sign-in" className={linkClass}>
              Sign in
            </Link>
          </>
        }
      >
        <Notice tone="caution" className="mb-4">
          {link.message}
        </Notice>
        <LinkButton href="/sign-up">Start again</LinkButton>
      </AuthCard>
    );
  }
  const trial = await findPlanByCode(TRIAL_PLAN_CODE);
  return (
    <AuthCard
      title="Finish creating your account"
      intro={
        <>
          Address confirmed: {link.email}. One click creates <strong className="text-stone-900">{link.companyName}</strong> on a free {trial?.trialDays ?? 14}-day trial, with {link.name} as
          its admin, and signs you in.
        </>
      }
    >
      <ConfirmSignUpForm token={token} />
    </AuthCard>
  );
}
