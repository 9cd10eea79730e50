'use client';

import Link from 'next/link';
import useSWR from 'swr';
import type { StudyDashboard as Dashboard } from '@/db/queries/studies';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { fetchJson } from '@/components/study/fetch-json';
import { dateFmt } from '@/components/study/format';
import { diameterLabel } from '@/server/study-option';

const TILES: { key: keyof Dashboard['counts']; label: string; href: string }[] = [
  { key: 'studiesThisMonth', label: 'Studies this month', href: '/studies' },
  { key: 'studies', label: 'Studies in all', href: '/studies' },
  { key: 'customers', label: 'Customers', href: '/customers' },
  { key: 'sites', label: 'Sites', href: '/sites' },
  { key: 'dishes', label: 'Dishes offered', href: '/dishes' },
  { key: 'serviceProfiles', label: 'Services', href: '/services' },
  { key: 'climateProfiles', label: 'Climate profiles', href: '/climate' },
];

/** The home screen's figures and latest studies, fetched from /api/v1/dashboard with SWR. */
export function StudyDashboard({ canStudy }: { canStudy: boolean }) {
  const { data, error, isLoading } = useSWR<Dashboard>('/api/v1/dashboard', fetchJson, { refreshInterval: 60_000 });
  if (error) {
    return (
      <p role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800">
        The dashboard could not be loaded: {(error as Error).message}
      </p>
    );
  }
  const setupMissing = data && (data.counts.dishes === 0 || data.counts.serviceProfiles === 0 || data.counts.climateProfiles === 0);
  return (
    <div className="space-y-6" aria-busy={isLoading}>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-7">
        {TILES.map((t) => (
          <li key={t.key}>
            <Link href={t.href} className="block rounded-md border border-stone-200 bg-white px-3 py-3 hover:border-ledger-400">
              <span className="num block text-left text-2xl font-semibold text-stone-900">{data ? data.counts[t.key].toLocaleString('en-US') : '–'}</span>
              <span className="mt-0.5 block text-xs text-stone-600">{t.label}</span>
            </Link>
          </li>
        ))}
      </ul>
      {setupMissing && (
        <p className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-sm text-amber-900">
          Before the first study: add at least one dish, one satellite service and one climate profile.
        </p>
      )}
      <Card aria-labelledby="recent-title">
        <CardHeader
          id="recent-title"
          title="Recent studies"
          actions={
            canStudy ? (
              <Link href="/studies/new" className="text-sm font-medium text-ledger-700 hover:underline">
                New study
              </Link>
            ) : undefined
          }
        />
        <CardBody className="px-0 sm:px-0">
          <Table caption="Recent studies">
            <THead>
              <tr>
                <Th>Study</Th>
                <Th className="hidden md:table-cell">Customer · site</Th>
                <Th numeric>Smallest meeting the target</Th>
                <Th className="hidden sm:table-cell">Made</Th>
              </tr>
            </THead>
            <TBody>
              {(!data || data.recent.length === 0) && <EmptyRow colSpan={4}>{isLoading ? 'Loading…' : 'No studies yet.'}</EmptyRow>}
              {data?.recent.map((s) => (
                <tr key={s.id}>
                  <Td>
                    <Link href={`/studies/${s.id}`} className="font-medium text-ledger-800 hover:underline">
                      {s.title}
                    </Link>
                    <span className="block text-xs text-stone-600 md:hidden">
                      {s.customerName} · {dateFmt.format(new Date(s.createdAt))}
                    </span>
                  </Td>
                  <Td className="hidden md:table-cell">
                    {s.customerName}
                    <span className="block text-xs text-stone-600">{s.siteName}</span>
                  </Td>
                  <Td numeric>{s.recommendedDiameterM === null ? <span className="text-stone-600">none</span> : diameterLabel(s.recommendedDiameterM).cm}</Td>
                  <Td className="hidden whitespace-nowrap sm:table-cell">{dateFmt.format(new Date(s.createdAt))}</Td>
                </tr>
              ))}
            </TBody>
          </Table>
        </CardBody>
      </Card>
    </div>
  );
}
