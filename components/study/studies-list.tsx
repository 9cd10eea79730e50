'use client';

import Link from 'next/link';
import type { StudyListItem } from '@/db/queries/studies';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { PagedList } from './paged-list';
import { dateFmt, diameterLabel, fixed } from './format';

/** The studies list: search by title, customer, site or service; newest first. */
export function StudiesList() {
  return (
    <PagedList<StudyListItem>
      endpoint="/api/v1/studies"
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
            {items.length === 0 && <EmptyRow colSpan={7}>{loading ? 'Loading studies…' : 'No studies match.'}</EmptyRow>}
            {items.map((s) => (
              <tr key={s.id} className="hover:bg-stone-50">
                <Td>
                  <Link href={`/studies/${s.id}`} className="font-medium text-ledger-800 underline-offset-2 hover:underline">
                    {s.title}
                  </Link>
                  {s.revision > 1 && <span className="ml-1 text-xs text-stone-600">rev. {s.revision}</span>}
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
  );
}
