import Link from 'next/link';
import type { Metadata } from 'next';
import { Notice } from '@/components/ui/notice';
import { inspectInvitation, INVITATION_DEAD } from '@/server/auth/invitations';
import { getAuthContext } from '@/server/auth/guards';
import { looksLikeToken } from '@/server/auth/tokens';
import { ROLE_LABELS, ROLE_DESCRIPTIONS } from '@/server/auth/permissions';
import { AuthCard } from '../../auth-card';
import { NewAccountForm, ExistingAccountForm, JoinSignedInForm } from './accept-forms';

export const metadata: Metadata = { title: 'Invitation', referrer: 'no-referrer' };

const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const view = looksLikeToken(token) ? await inspectInvitation(token) : ({ state: 'unknown', message: INVITATION_DEAD.unknown } as const);
  if (view.state !== 'valid') {
    return (
      <AuthCard title="This invitation cannot be used" footer={<Link href="/sign-in" className="text-ledger-700 underline-offset-2 hover:underline">Go to sign in</Link>}>
        <Notice tone="caution">{view.message}</Notice>
      </AuthCard>
    );
  }
  const ctx = await getAuthContext();
  const signedInAsInvitee = ctx?.user.email === view.email;
  const intro = (
    <>
      <p>
        You are invited to work in <strong className="text-stone-900">{view.companyName}</strong>&apos;s FadeLedger account as <strong className="text-stone-900">{ROLE_LABELS[view.role]}</strong>.
      </p>
      <p className="mt-1 text-stone-500">{ROLE_DESCRIPTIONS[view.role]}</p>
      <p className="mt-1 text-stone-500">The invitation is for {view.email} and expires on {dateFmt.format(view.expiresAt)}.</p>
    </>
  );
  return (
    <AuthCard title={`Join ${view.companyName}`} intro={intro}>
      {ctx && !signedInAsInvitee && (
        <Notice tone="info" className="mb-4">
          You are signed in as {ctx.user.email}. This invitation is for {view.email}; accepting it signs you in as that account instead.
        </Notice>
      )}
      {signedInAsInvitee ? <JoinSignedInForm token={token} /> : view.accountExists ? <ExistingAccountForm token={token} email={view.email} /> : <NewAccountForm token={token} email={view.email} />}
    </AuthCard>
  );
}
