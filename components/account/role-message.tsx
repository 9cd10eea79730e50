import Link from 'next/link';
import { getAuthContext } from '@/server/auth/guards';
import { listMembers } from '@/db/queries/team';
import { ROLE_LABELS } from '@/server/auth/permissions';

/**
 * The 403 page (forbidden()): the page exists but is not for this role. Names the role, and who
 * can change it: the company's admins, by name and address, so the person knows whom to ask.
 */
export async function RoleMessage() {
  const ctx = await getAuthContext();
  const admins = ctx?.companyId != null ? (await listMembers(ctx.companyId)).filter((m) => m.role === 'admin' && m.userId !== ctx.user.id) : [];
  const role = ctx ? ROLE_LABELS[ctx.role] : null;
  return (
    <main className="mx-auto max-w-xl px-6 py-16" aria-labelledby="role-message-title">
      <p className="font-mono text-sm text-ledger-700">403</p>
      <h1 id="role-message-title" className="mt-2 text-2xl font-semibold text-stone-900">
        Not available to your role
      </h1>
      {ctx?.role === 'staff' ? (
        <p className="mt-3 text-stone-700">This page belongs to a company’s workspace. As FadeLedger staff you work on the staff pages.</p>
      ) : (
        <>
          <p className="mt-3 text-stone-700">
            {role ? (
              <>
                You are signed in as <strong>{role}</strong>
                {ctx?.company ? <> at {ctx.company.name}</> : null}, and this page is for other roles.
              </>
            ) : (
              <>This page is not open to your account.</>
            )}
          </p>
          <p className="mt-3 text-stone-700">Your company’s admins choose each member’s role and can give you access.</p>
          {admins.length > 0 && (
            <ul className="mt-3 space-y-1 text-sm text-stone-700" aria-label="Your company’s admins">
              {admins.slice(0, 5).map((a) => (
                <li key={a.userId}>
                  {a.name} · <a className="text-ledger-700 underline" href={`mailto:${a.email}`}>{a.email}</a>
                </li>
              ))}
            </ul>
          )}
        </>
      )}
      <Link href={ctx?.role === 'staff' ? '/staff' : '/dashboard'} className="mt-6 inline-block text-ledger-700 underline">
        {ctx?.role === 'staff' ? 'Back to the staff pages' : 'Back to your dashboard'}
      </Link>
    </main>
  );
}
