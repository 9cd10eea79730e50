'use client';

import { useCallback, useState, type ReactNode } from 'react';
import { QuotePriceError, quoteTotals, type QuoteTotals } from '@/server/quotes/totals';
import { formatMoney } from '@/server/money-format';

type PriceField = 'hardwarePrice' | 'labourPrice' | 'extrasPrice' | 'discountAmount' | 'taxRatePercent';

function read(form: HTMLFormElement): Record<PriceField, string> {
  const data = new FormData(form);
  const get = (n: string, blank: string) => {
    const v = String(data.get(n) ?? '').trim().replace(/^\$/, '').replace(/,/g, '').replace(/%$/, '').trim();
    return v === '' ? blank : v;
  };
  return { hardwarePrice: get('hardwarePrice', '0'), labourPrice: get('labourPrice', '0'), extrasPrice: get('extrasPrice', '0'), discountAmount: get('discountAmount', '0'), taxRatePercent: get('taxRatePercent', '0') };
}

/**
 * Wraps the price fields and shows subtotal, tax and total as they are typed, with the same
 * exact arithmetic the server uses (server/quotes/totals.ts); the server computes them again.
 */
export function TotalsPreview({ children, currency = 'USD' }: { children: ReactNode; currency?: string }) {
  const [totals, setTotals] = useState<QuoteTotals | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const recomputeFrom = useCallback((el: Element | null) => {
    const form = el?.closest('form');
    if (!form) return;
    try {
      setTotals(quoteTotals(read(form)));
      setProblem(null);
    } catch (e) {
      setTotals(null);
      setProblem(e instanceof QuotePriceError ? e.message : 'Check the amounts.');
    }
  }, []);
  // First figures when the wrapper is mounted (the fields may hold an edited quote's prices), then on every edit.
  const recompute = (e: { currentTarget: HTMLDivElement }) => recomputeFrom(e.currentTarget);
  return (
    <div ref={recomputeFrom} onInput={recompute} onChange={recompute}>
      {children}
      <dl className="mt-4 grid max-w-sm grid-cols-[1fr_auto] gap-x-6 gap-y-1 rounded border border-stone-200 bg-stone-50 px-4 py-3 text-sm" aria-live="polite">
        {totals ? (
          <>
            <dt className="text-stone-600">Subtotal</dt>
            <dd className="num">{formatMoney(totals.subtotal, currency)}</dd>
            <dt className="text-stone-600">Tax</dt>
            <dd className="num">{formatMoney(totals.taxAmount, currency)}</dd>
            <dt className="font-semibold">Total</dt>
            <dd className="num font-semibold">{formatMoney(totals.total, currency)}</dd>
          </>
        ) : (
          <dd className="col-span-2 text-stone-700">{problem ?? 'Enter the prices to see the total.'}</dd>
        )}
      </dl>
    </div>
  );
}
