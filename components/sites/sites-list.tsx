'use client';

import { Fragment, useState } from 'react';
import Link from 'next/link';
import type { SiteListItem } from '@/db/queries/sites';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { Button } from '@/components/ui/button';
import { PagedList } from '@/components/study/paged-list';
import { formatDms } from '@/server/validation/coordinates';
import { fixed } from '@/components/study/format';
import { SiteForm } from './site-form';

/**
 * Sites with their customer and coordinates; a study can start from any row, and roles that may
 * write (customer.write) edit a site in place. Studies made earlier keep the coordinates they used.
 */
export function SitesList({ canStudy, canEdit = false, customers = [] }: { canStudy: boolean; canEdit?: boolean; customers?: { id: number; name: string }[] }) {
  const [editing, setEditing] = useState<number | null>(null);
  const hasActions = canStudy || canEdit;
  const columns = hasActions ? 7 : 6;
  const actions = (s: SiteListItem, open: boolean, panelId: string) => (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 sm:justify-end">
      {canStudy && (
        <Link href={`/studies/new?site=${s.id}`} className="text-sm font-medium text-ledger-700 hover:underline">
          New study<span className="sr-only"> for {s.name}</span>
        </Link>
      )}
      {canEdit && (
        <Button variant="quiet" size="sm" aria-expanded={open} aria-controls={open ? panelId : undefined} onClick={() => setEditing(open ? null : s.id)}>
          {open ? 'Close' : 'Edit'}
          <span className="sr-only"> {s.name}</span>
        </Button>
      )}
    </div>
  );
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
              <Th numeric>
                <span className="sm:hidden">Position</span>
                <span className="hidden sm:inline">Latitude</span>
              </Th>
              <Th numeric className="hidden sm:table-cell">Longitude</Th>
              <Th numeric className="hidden sm:table-cell">Altitude</Th>
              <Th numeric className="hidden sm:table-cell">Studies</Th>
              {hasActions && (
                <Th className="hidden sm:table-cell">
                  <span className="sr-only">Actions</span>
                </Th>
              )}
            </tr>
          </THead>
          <TBody>
            {items.length === 0 && <EmptyRow colSpan={columns}>{loading ? 'Loading sites…' : 'No sites match.'}</EmptyRow>}
            {items.map((s) => {
              const open = editing === s.id;
              const panelId = `site-edit-${s.id}`;
              return (
                <Fragment key={s.id}>
                  <tr className={open ? 'bg-ledger-50/40' : undefined}>
                    <Th scope="row" className="align-top font-medium text-stone-900">
                      {s.name}
                      {s.address && <span className="block text-xs font-normal text-stone-600">{s.address}</span>}
                      <span className="block text-xs font-normal text-stone-600 md:hidden">{s.customerName}</span>
                      {/* Phones: the actions sit under the name, so the table fits without sideways scrolling. */}
                      {hasActions && <div className="mt-1 font-normal sm:hidden">{actions(s, open, panelId)}</div>}
                    </Th>
                    <Td className="hidden md:table-cell">{s.customerName}</Td>
                    <Td numeric className="whitespace-nowrap">
                      {formatDms(s.latDeg, 'lat')}
                      <span className="block text-xs text-stone-600">{fixed(s.latDeg, 5)}</span>
                      <span className="mt-1 block sm:hidden">{formatDms(s.lonDeg, 'lon')}</span>
                      <span className="block text-xs text-stone-600 sm:hidden">{fixed(s.lonDeg, 5)}</span>
                    </Td>
                    <Td numeric className="hidden whitespace-nowrap sm:table-cell">
                      {formatDms(s.lonDeg, 'lon')}
                      <span className="block text-xs text-stone-600">{fixed(s.lonDeg, 5)}</span>
                    </Td>
                    <Td numeric className="hidden whitespace-nowrap sm:table-cell">
                      {fixed(s.altitudeM, 0)} m
                      <span className="block text-xs text-stone-600">{s.altitudeSource === 'user' ? 'entered' : 'ITU-R P.1511-1 map'}</span>
                    </Td>
                    <Td numeric className="hidden sm:table-cell">{s.studyCount}</Td>
                    {hasActions && <Td className="hidden whitespace-nowrap sm:table-cell">{actions(s, open, panelId)}</Td>}
                  </tr>
                  {canEdit && open && (
                    <tr id={panelId}>
                      <td colSpan={columns} className="bg-stone-50 px-4 py-4 sm:px-5">
                        <SiteForm key={s.id} customers={customers} site={s} onSaved={() => setEditing(null)} onCancel={() => setEditing(null)} />
                      </td>
                    </tr>
                  )}
                </Fragment>
              );
            })}
          </TBody>
        </Table>
      )}
    />
  );
}
