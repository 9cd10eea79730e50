import type { Metadata } from 'next';
import Link from 'next/link';
import { requireStaffPermission } from '@/server/auth/guards';
import { listAccounts } from '@/db/queries/billing';
import { StatusBadge } from '@/components/billing/status-badge';
import { billingDate, count } from '@/components/billing/format';

export const metadata: Metadata = { title: 'Accounts' };
export const dynamic = 'force-dynamic';

const PAGE_SIZE = 50;

/** One page of accounts and the time they were read at (which trials have ended by then). */
async function loadAccounts(search: string, page: number) {
  const { rows, total } = await listAccounts({ search, limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE });
  return { rows, total, now: Date.now() };
}

/** Staff: every company with its plan and subscription state; each opens its account page. */
export default async function AccountsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requireStaffPermission('accounts.read');
  const sp = await searchParams;
  const q = typeof sp.q === 'string' ? sp.q.slice(0, 120) : '';
  const page = Math.max(1, Number(typeof sp.page === 'string' && /^\d{1,5}$/.test(sp.page) ? sp.page : 1));
  const { rows, total, now } = await loadAccounts(q, page);
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight text-stone-900">Accounts</h1>
          <p className="mt-1 text-sm text-stone-600">{count(total)} {total === 1 ? 'company' : 'companies'}{q ? ` matching “${q}”` : ''}.</p>
        </div>
        <form className="flex gap-2" role="search">
          <label htmlFor="q" className="sr-only">Search companies</label>
          <input id="q" name="q" defaultValue={q} placeholder="Company name" className="rounded border border-stone-300 bg-white px-2 py-1.5 text-sm" />
          <button type="submit" className="rounded border border-stone-300 bg-white px-3 py-1.5 text-sm font-medium hover:border-ledger-600">Search</button>
        </form>
      </header>
      <div className="overflow-x-auto rounded border border-stone-200 bg-white">
        <table className="w-full min-w-[48rem] text-sm">
          <thead>
            <tr className="border-b border-stone-300 text-left text-xs uppercase tracking-wide text-stone-500">
              <th scope="col" className="px-3 py-2 font-medium">Company</th>
              <th scope="col" className="px-3 py-2 font-medium">Plan</th>
              <th scope="col" className="px-3 py-2 font-medium">Status</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Seats used</th>
              <th scope="col" className="px-3 py-2 font-medium">Period end / trial end</th>
              <th scope="col" className="px-3 py-2 font-medium">Since</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => {
              const trialOver = r.planKind === 'trial' && r.trialEndsAt && r.trialEndsAt.getTime() <= now;
              return (
                <tr key={r.companyId} className="border-b border-stone-200 last:border-0">
                  <th scope="row" className="px-3 py-2 text-left font-medium text-stone-900">
                    <Link className="text-ledger-800 underline-offset-2 hover:underline" href={`/accounts/${r.companyId}`}>{r.companyName}</Link>
                  </th>
                  <td className="px-3 py-2">{r.planName}</td>
                  <td className="px-3 py-2">
                    {r.subscriptionStatus ? (
                      <StatusBadge status={r.subscriptionStatus} label={r.cancelAtPeriodEnd && r.subscriptionStatus === 'active' ? 'Active · cancels' : undefined} />
                    ) : (
                      <StatusBadge status={trialOver ? 'canceled' : 'active'} label={r.planKind === 'trial' ? (trialOver ? 'Trial ended' : 'Trial') : r.planKind === 'free' ? 'Free' : 'Assigned'} />
                    )}
                    {r.graceEndsAt && <span className="block text-xs text-amber-800">grace until {billingDate(r.graceEndsAt)}</span>}
                  </td>
                  <td className="num px-3 py-2">{count(r.members + r.pendingInvitations)}</td>
                  <td className="px-3 py-2 font-mono text-xs">{r.subscriptionStatus ? billingDate(r.currentPeriodEnd) : r.planKind === 'trial' ? billingDate(r.trialEndsAt) : '—'}</td>
                  <td className="px-3 py-2 font-mono text-xs">{billingDate(r.createdAt)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {pages > 1 && (
        <nav aria-label="Pages" className="flex gap-3 text-sm">
          {page > 1 && <a className="text-ledger-700 hover:underline" href={`?q=${encodeURIComponent(q)}&page=${page - 1}`}>← Previous</a>}
          <span className="text-stone-600">Page {page} of {pages}</span>
          {page < pages && <a className="text-ledger-700 hover:underline" href={`?q=${encodeURIComponent(q)}&page=${page + 1}`}>Next →</a>}
        </nav>
      )}
    </div>
  );
}
