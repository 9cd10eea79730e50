'use client';

import { useState } from 'react';
import Link from 'next/link';
import type { StudyListItem } from '@/db/queries/studies';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { PagedList } from './paged-list';
import { dateFmt, fixed } from './format';
import { diameterLabel } from '@/server/study-option';

/** The studies list: search by title, customer, site or service; newest first; archived ones only on request. */
export function StudiesList() {
  const [showArchived, setShowArchived] = useState(false);
  return (
    <div>
      <label className="mb-2 inline-flex items-center gap-2 text-sm text-stone-700">
        <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} className="accent-ledger-700" />
        Show archived studies
      </label>
    <PagedList<StudyListItem>
      endpoint="/api/v1/studies"
      extraQuery={showArchived ? '&archived=include' : ''}
      searchLabel="Search"
      searchPlaceholder="Title, customer, site or service"
      render={(items, { loading }) => (
        <Table caption="Studies">
          <THead>
            <tr>
              <Th>Study</Th>
              <Th className="hidden md:table-cell">Customer · site</Th>
              <Th className="hidden lg:table-cell">Service</Th>
              <Th numeric className="hidden sm:table-cell">Dishes</Th>
              <Th numeric className="hidden sm:table-cell">Target</Th>
              <Th numeric>Smallest meeting it</Th>
              <Th className="hidden sm:table-cell">Made</Th>
            </tr>
          </THead>
          <TBody>
            {items.length === 0 && <EmptyRow colSpan={7}>{loading ? 'Loading studies…' : showArchived ? 'No studies match.' : 'No studies match (archived studies are hidden).'}</EmptyRow>}
            {items.map((s) => (
              <tr key={s.id} className="hover:bg-stone-50">
                <Td>
                  <Link href={`/studies/${s.id}`} className="font-medium text-ledger-800 underline-offset-2 hover:underline">
                    {s.title}
                  </Link>
                  {s.revision > 1 && <span className="ml-1 text-xs text-stone-600">rev. {s.revision}</span>}
                  {s.status === 'archived' && <span className="ml-1 rounded bg-stone-100 px-1.5 py-0.5 text-xs text-stone-700">archived</span>}
                  <span className="block text-xs text-stone-600 md:hidden">
                    {s.customerName} · {s.siteName} · {dateFmt.format(new Date(s.createdAt))}
                  </span>
                </Td>
                <Td className="hidden md:table-cell">
                  {s.customerName}
                  <span className="block text-xs text-stone-600">{s.siteName}</span>
                </Td>
                <Td className="hidden lg:table-cell">{s.serviceName}</Td>
                <Td numeric className="hidden sm:table-cell">{s.dishCount}</Td>
                <Td numeric className="hidden whitespace-nowrap sm:table-cell">{fixed(s.targetAvailabilityPercent, 3)} %</Td>
                <Td numeric>{s.recommendedDiameterM === null ? <span className="text-stone-600">none</span> : diameterLabel(s.recommendedDiameterM).cm}</Td>
                <Td className="hidden whitespace-nowrap text-stone-700 sm:table-cell">
                  {dateFmt.format(new Date(s.createdAt))}
                  {s.createdByName && <span className="block text-xs text-stone-600">{s.createdByName}</span>}
                </Td>
              </tr>
            ))}
          </TBody>
        </Table>
      )}
    />
    </div>
  );
}
