import type { Metadata } from 'next';
import Link from 'next/link';
import { getFreeTierPlan, getTrialPlan, listPublicPlans } from '@/db/queries/billing';
import { count } from '@/components/billing/format';
import { formatMoney } from '@/server/money-format';

export const metadata: Metadata = { title: 'Plans and prices', description: 'FadeLedger plans: seats, studies per month, comparison links, uploads and API access.' };
// Plans live in MariaDB and staff change them; read them on each request.
export const dynamic = 'force-dynamic';

export default async function PricingPage() {
  const [plans, trial, free] = await Promise.all([listPublicPlans(), getTrialPlan(), getFreeTierPlan()]);
  return (
    <div className="mx-auto max-w-6xl px-6 py-12">
      <h1 className="text-3xl font-semibold tracking-tight text-stone-900">Plans and prices</h1>
      <p className="mt-3 max-w-2xl text-stone-600">
        {trial?.trialDays ? `Every account starts with a ${trial.trialDays}-day ${trial.name.toLowerCase()} with room for ${trial.seatLimit} people. ` : ''}
        Afterwards, pick a plan{free ? ` — or stay on ${free.name} for free, with ${free.seatLimit === 1 ? 'one seat' : `${free.seatLimit} seats`}` : ''}.
        Prices in US dollars per month; change or cancel any time.
      </p>
      <ul className="mt-8 grid gap-5 md:grid-cols-3">
        {plans.map((p) => (
          <li key={p.id} className="flex flex-col rounded border border-stone-200 bg-white p-5">
            <h2 className="text-lg font-semibold text-stone-900">{p.name}</h2>
            <p className="mt-1 font-mono text-2xl text-stone-900">{p.kind === 'paid' ? formatMoney(p.monthlyPriceUsd) : '$0'}<span className="text-sm text-stone-500"> / month</span></p>
            {p.description && <p className="mt-2 text-sm text-stone-600">{p.description}</p>}
            <table className="mt-4 text-sm">
              <tbody>
                {[
                  ['Seats', count(p.seatLimit)],
                  ['Studies per month', count(p.studiesPerMonth)],
                  ['Active comparison links', count(p.activeLinksLimit)],
                  ['CSV uploads per month', count(p.uploadsPerMonth)],
                  ['Trade-off API', p.apiAccess ? 'Included' : '—'],
                  ['Your logo on quotes', p.quoteBranding ? 'Included' : '—'],
                ].map(([k, v]) => (
                  <tr key={k} className="border-b border-stone-100 last:border-0">
                    <th scope="row" className="py-1.5 pr-3 text-left font-normal text-stone-600">{k}</th>
                    <td className="num py-1.5">{v}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="mt-auto pt-5">
              <Link href="/sign-up" className="block rounded bg-ledger-700 px-3 py-2 text-center text-sm font-medium text-white hover:bg-ledger-800">Start the free trial</Link>
            </div>
          </li>
        ))}
      </ul>
      <p className="mt-6 text-xs text-stone-500">Seats count members and pending invitations. Monthly allowances restart on the 1st of each month (UTC).</p>
    </div>
  );
}
