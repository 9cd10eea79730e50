import type { PlanLimits, PlanUsage } from '@/server/billing/limits';
import { count } from './format';

type Row = { label: string; note: string; used: number | null; limit: number | boolean };

function rows(limits: PlanLimits, usage: PlanUsage): Row[] {
  return [
    { label: 'Seats', note: 'members and pending invitations', used: usage.seats, limit: limits.seats },
    { label: 'Studies', note: 'this calendar month (UTC)', used: usage.studiesPerMonth, limit: limits.studiesPerMonth },
    { label: 'Active comparison links', note: 'not revoked, not expired', used: usage.activeLinks, limit: limits.activeLinks },
    { label: 'Uploads', note: 'this calendar month (UTC)', used: usage.uploadsPerMonth, limit: limits.uploadsPerMonth },
    { label: 'Trade-off API', note: 'POST /api/v1/tradeoff', used: null, limit: limits.apiAccess },
    { label: 'Quote branding', note: 'your logo on quotes', used: null, limit: limits.quoteBranding },
  ];
}

/** Each limit that applies now, with what the company has used of it. */
export function UsageTable({ limits, usage }: { limits: PlanLimits; usage: PlanUsage }) {
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Plan limits and usage</caption>
      <thead>
        <tr className="border-b border-stone-300 text-left text-xs uppercase tracking-wide text-stone-500">
          <th scope="col" className="py-2 pr-3 font-medium">Limit</th>
          <th scope="col" className="py-2 pr-3 text-right font-medium">Used</th>
          <th scope="col" className="py-2 pr-3 text-right font-medium">Allowed</th>
          <th scope="col" className="hidden w-40 py-2 font-medium sm:table-cell"><span className="sr-only">Share used</span></th>
        </tr>
      </thead>
      <tbody>
        {rows(limits, usage).map((r) => {
          const numeric = typeof r.limit === 'number';
          const share = numeric && r.used !== null ? (r.limit === 0 ? 1 : Math.min(1, r.used / (r.limit as number))) : null;
          const full = share !== null && share >= 1;
          return (
            <tr key={r.label} className="border-b border-stone-200 align-top">
              <th scope="row" className="py-2 pr-3 text-left font-medium text-stone-800">
                {r.label}
                <span className="block text-xs font-normal text-stone-500">{r.note}</span>
              </th>
              <td className={`num py-2 pr-3 ${full ? 'font-semibold text-amber-800' : ''}`}>{r.used === null ? '' : count(r.used)}</td>
              <td className="num py-2 pr-3">{numeric ? count(r.limit as number) : r.limit ? 'Yes' : <><span aria-hidden="true">—</span><span className="sr-only">Not included</span></>}</td>
              <td className="hidden py-3 sm:table-cell">
                {share !== null && (
                  <div className="h-1.5 w-full rounded bg-stone-200" aria-hidden="true">
                    <div className={`h-1.5 rounded ${full ? 'bg-amber-500' : 'bg-ledger-500'}`} style={{ width: `${Math.round(share * 100)}%` }} />
                  </div>
                )}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
