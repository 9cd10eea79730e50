import type { Metadata } from 'next';
import Link from 'next/link';
import { requireStaffPermission } from '@/server/auth/guards';
import { countCompaniesOnPlan, getPlanProviderSync, listAllPlans } from '@/db/queries/billing';
import { SyncPlanButton } from '@/components/billing/sync-plan-button';
import { billingDate, count } from '@/components/billing/format';
import { formatMoney } from '@/server/money-format';

export const metadata: Metadata = { title: 'Plan catalogue' };
export const dynamic = 'force-dynamic';

/** Staff: every plan with its limits and its state at the payment provider. */
export default async function PlansPage() {
  await requireStaffPermission('plans.manage');
  const plans = await listAllPlans();
  const [sync, companies] = await Promise.all([getPlanProviderSync(plans.map((p) => p.id)), Promise.all(plans.map((p) => countCompaniesOnPlan(p.id)))]);
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight text-stone-900">Plan catalogue</h1>
          <p className="mt-1 text-sm text-stone-600">Limits are enforced from here. Saving a paid plan syncs its product and monthly price to the payment provider.</p>
        </div>
        <Link href="/plans/new" className="rounded bg-ledger-700 px-3 py-2 text-sm font-medium text-white hover:bg-ledger-800">New plan</Link>
      </header>
      <div className="overflow-x-auto rounded border border-stone-200 bg-white">
        <table className="w-full min-w-[56rem] text-sm">
          <thead>
            <tr className="border-b border-stone-300 text-left text-xs uppercase tracking-wide text-stone-500">
              <th scope="col" className="px-3 py-2 font-medium">Plan</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Price / month</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Seats</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Studies / mo</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Links</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Uploads / mo</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Sites / campaign</th>
              <th scope="col" className="px-3 py-2 font-medium">API · Branding</th>
              <th scope="col" className="px-3 py-2 text-right font-medium">Companies</th>
              <th scope="col" className="px-3 py-2 font-medium">Provider</th>
              <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {plans.map((p, i) => {
              const s = sync.get(p.id);
              return (
                <tr key={p.id} className="border-b border-stone-200 align-top last:border-0">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    <Link href={`/plans/${p.id}`} className="text-ledger-800 hover:underline">{p.name}</Link>
                    <span className="block font-mono text-xs font-normal text-stone-500">{p.code} · {p.kind}{p.isPublic ? '' : ' · hidden'}</span>
                  </th>
                  <td className="num px-3 py-2">{p.kind === 'paid' ? formatMoney(p.monthlyPriceUsd) : '—'}</td>
                  <td className="num px-3 py-2">{count(p.seatLimit)}</td>
                  <td className="num px-3 py-2">{count(p.studiesPerMonth)}</td>
                  <td className="num px-3 py-2">{count(p.activeLinksLimit)}</td>
                  <td className="num px-3 py-2">{count(p.uploadsPerMonth)}</td>
                  <td className="num px-3 py-2">{count(p.campaignSitesLimit)}</td>
                  <td className="px-3 py-2">{p.apiAccess ? 'API' : '—'} · {p.quoteBranding ? 'Branding' : '—'}</td>
                  <td className="num px-3 py-2">{count(companies[i])}</td>
                  <td className="px-3 py-2 text-xs">
                    {p.kind !== 'paid' && !p.stripePriceId ? (
                      <span className="text-stone-500">Not sold</span>
                    ) : s?.error ? (
                      <span className="text-red-700">Sync failed: {s.error}</span>
                    ) : s?.syncedAt && p.stripePriceId ? (
                      <span className="text-stone-700">Synced {billingDate(s.syncedAt)}<span className="block font-mono text-stone-500">{p.stripePriceId}</span></span>
                    ) : (
                      <span className="text-amber-800">Not synced yet</span>
                    )}
                  </td>
                  <td className="px-3 py-2">{p.kind === 'paid' && <SyncPlanButton planId={p.id} />}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-stone-500">
        Price changes create a new price object at the provider (prices cannot be edited there); existing subscribers stay on their price until
        they change plan, and still count as this plan. A paid plan that was never synced is synced on its first checkout.
      </p>
    </div>
  );
}
