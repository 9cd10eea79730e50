'use client';

import { useEffect, useState, type ReactNode } from 'react';
import useSWR from 'swr';
import type { Paged } from '@/server/validation/paging';
import { Button } from '@/components/ui/button';
import { fetchJson } from './fetch-json';
import { INPUT_CLASSES } from '@/components/ui/field';

/** Search text settles for a moment before it is sent, so typing does not fire a request per key. */
function useDebounced(value: string, ms = 250): string {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/**
 * A searchable, paged list fetched with SWR from one of the /api/v1 list routes. The caller
 * renders the rows; this owns the search box, the pages and the loading and error lines.
 */
export function PagedList<T>({
  endpoint,
  searchLabel,
  searchPlaceholder,
  pageSize = 20,
  extraQuery = '',
  render,
}: {
  endpoint: string;
  searchLabel: string;
  searchPlaceholder?: string;
  pageSize?: number;
  extraQuery?: string;
  render: (items: T[], state: { loading: boolean }) => ReactNode;
}) {
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const query = useDebounced(q);
  // A new search starts again at page 1 (state adjusted while rendering, not in an effect).
  const [pagedQuery, setPagedQuery] = useState(query);
  if (pagedQuery !== query) {
    setPagedQuery(query);
    setPage(1);
  }
  const url = `${endpoint}?q=${encodeURIComponent(query)}&page=${page}&pageSize=${pageSize}${extraQuery}`;
  const { data, error, isLoading } = useSWR<Paged<T>>(url, fetchJson, { keepPreviousData: true });
  return (
    <div>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
        <label className="flex w-full max-w-sm items-center gap-2 text-sm text-stone-700">
          <span className="shrink-0">{searchLabel}</span>
          <input type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder={searchPlaceholder} className={INPUT_CLASSES} />
        </label>
        <p className="text-sm text-stone-600" aria-live="polite">
          {data ? `${data.total.toLocaleString('en-US')} found` : isLoading ? 'Loading…' : ''}
        </p>
      </div>
      {error ? (
        <p role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800">
          The list could not be loaded: {(error as Error).message}
        </p>
      ) : (
        render(data?.items ?? [], { loading: isLoading && !data })
      )}
      {data && data.pageCount > 1 && (
        <nav aria-label="Pages" className="mt-3 flex items-center justify-end gap-2 text-sm">
          <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => Math.max(1, p - 1))}>
            Previous
          </Button>
          <span className="num text-stone-700">
            Page {data.page} of {data.pageCount}
          </span>
          <Button variant="secondary" size="sm" disabled={page >= data.pageCount} onClick={() => setPage((p) => p + 1)}>
            Next
          </Button>
        </nav>
      )}
    </div>
  );
}
