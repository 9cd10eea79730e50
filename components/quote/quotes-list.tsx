'use client';

import Link from 'next/link';
import { useState } from 'react';
import useSWR from 'swr';
import type { QuoteListItem } from '@/db/queries/quotes';
import type { QuoteStatus } from '@/server/quotes/status';
import { PagedList } from '@/components/study/paged-list';
import { fetchJson } from '@/components/study/fetch-json';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { quoteReference } from '@/server/quotes/status';
import { QuoteStatusBadge } from './status-badge';
import { day } from './format';
import { formatMoney } from '@/server/money-format';

const FILTERS: { value: 'all' | 'open' | QuoteStatus; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'draft', label: 'Drafts' },
  { value: 'open', label: 'Waiting for the customer' },
  { value: 'accepted', label: 'Accepted' },
  { value: 'declined', label: 'Declined' },
  { value: 'expired', label: 'Expired' },
];

type Counts = Record<QuoteStatus, number>;

function countFor(counts: Counts | undefined, value: (typeof FILTERS)[number]['value']): number | null {
  if (!counts) return null;
  if (value === 'all') return Object.values(counts).reduce((a, b) => a + b, 0);
  if (value === 'open') return counts.sent + counts.viewed;
  return counts[value];
}

/** What an empty list says: a company with no quotes at all is told how to make its first one. */
function emptyWords(total: number | null, canCreate: boolean) {
  if (total !== 0) return 'No quotes match.';
  return canCreate ? (
    <>
      No quotes yet. Open a <Link href="/studies" className="font-medium text-ledger-700 underline underline-offset-2">study</Link> and choose “Create quote” on the dish you recommend.
    </>
  ) : (
    'No quotes yet. An installer or admin makes them from a study; they appear here for you to share.'
  );
}

/** The quotes list: status filter, search (customer, site, number), newest first, paged. */
export function QuotesList({ canCreate = false }: { canCreate?: boolean }) {
  const [status, setStatus] = useState<(typeof FILTERS)[number]['value']>('all');
  // The counts come with every list answer; a tiny request keeps the chips current.
  const { data } = useSWR<{ counts: Counts }>('/api/v1/quotes?pageSize=1', fetchJson);
  return (
    <div>
      <fieldset className="mb-4">
        <legend className="sr-only">Show quotes</legend>
        <div className="flex flex-wrap gap-1.5">
          {FILTERS.map((f) => {
            const n = countFor(data?.counts, f.value);
            const active = status === f.value;
            return (
              <label key={f.value} className={`cursor-pointer rounded border px-2.5 py-1 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ledger-600 ${active ? 'border-ledger-700 bg-ledger-700 text-white' : 'border-stone-300 bg-white text-stone-700 hover:border-ledger-600'}`}>
                <input type="radio" name="status" value={f.value} checked={active} onChange={() => setStatus(f.value)} className="sr-only" />
                {f.label}
                {n !== null && <span className={`num ml-1.5 text-xs ${active ? 'text-ledger-100' : 'text-stone-500'}`}>{n}</span>}
              </label>
            );
          })}
        </div>
      </fieldset>
      <PagedList<QuoteListItem>
        key={status}
        endpoint="/api/v1/quotes"
        extraQuery={`&status=${status}`}
        searchLabel="Search"
        searchPlaceholder="Customer, site, e-mail or Q-number"
        render={(items, { loading }) => (
          <Table caption="Quotes">
            <THead>
              <tr>
                <Th>Quote</Th>
                <Th>Customer · site</Th>
                <Th className="hidden md:table-cell">Dish</Th>
                <Th numeric>Total</Th>
                <Th className="hidden sm:table-cell">Status</Th>
                <Th numeric className="hidden md:table-cell">Views</Th>
                <Th className="hidden md:table-cell">Valid until</Th>
              </tr>
            </THead>
            <TBody>
              {items.length === 0 && <EmptyRow colSpan={7}>{loading ? 'Loading quotes…' : emptyWords(countFor(data?.counts, 'all'), canCreate)}</EmptyRow>}
              {items.map((q) => (
                <tr key={q.id} className="hover:bg-stone-50">
                  <Td className="whitespace-nowrap">
                    <Link href={`/quotes/${q.id}`} className="font-mono font-medium text-ledger-800 underline-offset-2 hover:underline">
                      {quoteReference(q.number)}
                    </Link>
                    {q.createdByName && <span className="block text-xs text-stone-600">{q.createdByName}</span>}
                    {/* On phones the status rides under the number; the status column is hidden there. */}
                    <span className="mt-1 block sm:hidden">
                      <QuoteStatusBadge status={q.status} />
                    </span>
                  </Td>
                  <Td>
                    {q.customerName}
                    <span className="block text-xs text-stone-600">{q.siteName}</span>
                  </Td>
                  <Td className="hidden md:table-cell">{q.chosenDishName}</Td>
                  <Td numeric className="whitespace-nowrap">{formatMoney(q.total, q.currency)}</Td>
                  <Td className="hidden sm:table-cell">
                    <QuoteStatusBadge status={q.status} />
                  </Td>
                  <Td numeric className="hidden md:table-cell">{q.views}</Td>
                  <Td className="hidden whitespace-nowrap text-stone-700 md:table-cell">{day(q.validUntil)}</Td>
                </tr>
              ))}
            </TBody>
          </Table>
        )}
      />
    </div>
  );
}
