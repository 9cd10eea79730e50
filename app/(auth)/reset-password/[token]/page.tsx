import Link from 'next/link';
import type { Metadata } from 'next';
import { Notice } from '@/components/ui/notice';
import { inspectResetLink, RESET_LINK_DEAD } from '@/server/auth/password-reset';
import { looksLikeToken } from '@/server/auth/tokens';
import { AuthCard } from '../../auth-card';
import { ForgotPasswordForm } from '../../forgot-password/forgot-password-form';
import { ResetPasswordForm } from './reset-password-form';

// The token is in the path: keep it out of Referer headers sent to anything the page loads.
export const metadata: Metadata = { title: 'Choose a new password', referrer: 'no-referrer' };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = looksLikeToken(token) ? await inspectResetLink(token) : ({ state: 'dead' } as const);
  if (link.state !== 'valid') {
    return (
      <AuthCard title="This link no longer works" footer={<Link href="/sign-in" className="text-ledger-700 underline-offset-2 hover:underline">Back to sign in</Link>}>
        <Notice tone="caution" className="mb-4">
          {RESET_LINK_DEAD}
        </Notice>
        <ForgotPasswordForm />
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password" intro={<>For {link.email}. Every device signed in to this account will be signed out.</>}>
      <ResetPasswordForm token={token} email={link.email} />
    </AuthCard>
  );
}
