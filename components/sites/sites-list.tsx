'use client';

import Link from 'next/link';
import type { SiteListItem } from '@/db/queries/sites';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { PagedList } from '@/components/study/paged-list';
import { formatDms } from '@/server/validation/coordinates';
import { fixed } from '@/components/study/format';

/** Sites with their customer and coordinates; a study can start from any row. */
export function SitesList({ canStudy }: { canStudy: boolean }) {
  return (
    <PagedList<SiteListItem>
      endpoint="/api/v1/sites"
      searchLabel="Search"
      searchPlaceholder="Site, address or customer"
      render={(items, { loading }) => (
        <Table caption="Sites">
          <THead>
            <tr>
              <Th>Site</Th>
              <Th className="hidden md:table-cell">Customer</Th>
              <Th numeric>Latitude</Th>
              <Th numeric>Longitude</Th>
              <Th numeric className="hidden sm:table-cell">Altitude</Th>
              <Th numeric className="hidden sm:table-cell">Studies</Th>
              {canStudy && <Th><span className="sr-only">Actions</span></Th>}
            </tr>
          </THead>
          <TBody>
            {items.length === 0 && <EmptyRow colSpan={canStudy ? 7 : 6}>{loading ? 'Loading sites…' : 'No sites match.'}</EmptyRow>}
            {items.map((s) => (
              <tr key={s.id}>
                <Th scope="row" className="align-top font-medium text-stone-900">
                  {s.name}
                  {s.address && <span className="block text-xs font-normal text-stone-600">{s.address}</span>}
                  <span className="block text-xs font-normal text-stone-600 md:hidden">{s.customerName}</span>
                </Th>
                <Td className="hidden md:table-cell">{s.customerName}</Td>
                <Td numeric className="whitespace-nowrap">
                  {formatDms(s.latDeg, 'lat')}
                  <span className="block text-xs text-stone-600">{fixed(s.latDeg, 5)}</span>
                </Td>
                <Td numeric className="whitespace-nowrap">
                  {formatDms(s.lonDeg, 'lon')}
                  <span className="block text-xs text-stone-600">{fixed(s.lonDeg, 5)}</span>
                </Td>
                <Td numeric className="hidden sm:table-cell">{fixed(s.altitudeM, 0)} m</Td>
                <Td numeric className="hidden sm:table-cell">{s.studyCount}</Td>
                {canStudy && (
                  <Td className="whitespace-nowrap">
                    <Link href={`/studies/new?site=${s.id}`} className="text-sm font-medium text-ledger-700 hover:underline">
                      New study<span className="sr-only"> for {s.name}</span>
                    </Link>
                  </Td>
                )}
              </tr>
            ))}
          </TBody>
        </Table>
      )}
    />
  );
}
