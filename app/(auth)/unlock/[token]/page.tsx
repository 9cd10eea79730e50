import Link from 'next/link';
import type { Metadata } from 'next';
import { Notice } from '@/components/ui/notice';
import { inspectUnlockLink, UNLOCK_LINK_DEAD } from '@/server/auth/sign-in-unlock';
import { looksLikeToken } from '@/server/auth/tokens';
import { AuthCard } from '../../auth-card';
import { UnlockForm } from './unlock-form';

// The token is in the path: keep it out of Referer headers sent to anything the page loads.
export const metadata: Metadata = { title: 'Sign in from this browser', referrer: 'no-referrer' };

/**
 * The mailed link's page. Opening it changes nothing (mail scanners open links too); the button
 * spends the link and lets this browser past the sign-in limits for the address.
 */
export default async function UnlockPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = looksLikeToken(token) ? await inspectUnlockLink(token) : ({ state: 'dead' } as const);
  const back = (
    <Link href="/sign-in" className="text-ledger-700 underline-offset-2 hover:underline">
      Back to sign in
    </Link>
  );
  if (link.state !== 'valid') {
    return (
      <AuthCard title="This link no longer works" footer={back}>
        <Notice tone="caution">{UNLOCK_LINK_DEAD}</Notice>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Sign in from this browser" intro={<>For {link.email}. After this, sign in with your password as usual; what others try at this address no longer holds this browser back.</>} footer={back}>
      <UnlockForm token={token} />
    </AuthCard>
  );
}
