import Link from 'next/link';
import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { Notice } from '@/components/ui/notice';
import { getAuthContext } from '@/server/auth/guards';
import { safeNextPath } from '@/server/auth/schemas';
import { AuthCard } from '../auth-card';
import { SignInForm } from './sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

const NOTICES: Record<string, string> = {
  reset: 'Your password is changed and every device was signed out. Sign in with the new password.',
  'signed-out': 'You are signed out.',
  everywhere: 'You are signed out on every device.',
  left: 'You have left the company.',
  unlocked: 'This browser may sign in to that address now. Sign in with your password.',
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const params = await searchParams;
  const ctx = await getAuthContext();
  if (ctx) redirect(ctx.role === 'staff' ? '/staff' : '/dashboard');
  const notice = params.reset ? NOTICES.reset : params['signed-out'] === 'everywhere' ? NOTICES.everywhere : params['signed-out'] ? NOTICES['signed-out'] : params.left ? NOTICES.left : params.unlocked ? NOTICES.unlocked : null;
  return (
    <AuthCard
      title="Sign in to FadeLedger"
      footer={
        <>
          New to FadeLedger?{' '}
          <Link href="/sign-up" className="font-medium text-ledger-700 underline-offset-2 hover:underline">
            Start a free trial
          </Link>
        </>
      }
    >
      {notice && (
        <Notice tone="success" className="mb-4">
          {notice}
        </Notice>
      )}
      <SignInForm next={safeNextPath(params.next) ?? undefined} />
    </AuthCard>
  );
}
