'use client';

import { useState } from 'react';
import { ActionForm } from '@/components/ui/action-form';
import { FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { createQuote } from '@/server/actions/quotes';
import type { QuoteOptionSnapshot } from '@/server/quotes/snapshot';
import { readQuotedOption } from '@/server/study-option';
import { formatMoney } from '@/server/money-format';
import { NavigateOnSuccess } from '@/components/ui/navigate-on-success';
import { TermsFields, type TermsDefaults } from './terms-fields';

/**
 * New quote from a study: choose the option to quote (prices follow it), the options the
 * customer will see beside it, then customer, validity, prices and notes.
 */
export function NewQuoteForm({ studyId, options, initialOption, defaults }: { studyId: number; options: QuoteOptionSnapshot[]; initialOption: number; defaults: Omit<TermsDefaults, 'hardwarePrice' | 'labourPrice'> }) {
  const [chosen, setChosen] = useState(initialOption);
  const [shown, setShown] = useState<Set<number>>(() => new Set(options.filter((o) => o.closes || o.index === initialOption).map((o) => o.index)));
  const chosenOption = options.find((o) => o.index === chosen) ?? options[0];
  const toggle = (i: number) =>
    setShown((s) => {
      const next = new Set(s);
      if (next.has(i)) next.delete(i);
      else next.add(i);
      return next;
    });
  return (
    <ActionForm action={createQuote} className="space-y-8" aria-label="New quote">
      <input type="hidden" name="studyId" value={studyId} />
      <fieldset>
        <legend className="mb-1 text-sm font-semibold text-stone-900">Option to quote</legend>
        <p className="mb-3 text-sm text-stone-600">The quoted option is marked as your recommendation. Tick the others the customer should see beside it for comparison.</p>
        <div className="divide-y divide-stone-200 rounded border border-stone-200">
          {options.map((o) => {
            const reading = readQuotedOption(o);
            const isChosen = chosen === o.index;
            return (
              <div key={o.index} className={`flex flex-wrap items-start gap-x-4 gap-y-2 px-3 py-3 sm:flex-nowrap ${isChosen ? 'bg-ledger-50' : ''}`}>
                <label className="flex min-w-0 flex-1 cursor-pointer items-start gap-3">
                  <input type="radio" name="optionIndex" value={o.index} checked={isChosen} disabled={!o.closes} onChange={() => { setChosen(o.index); setShown((s) => new Set(s).add(o.index)); }} className="mt-1 accent-ledger-700" />
                  <span className="min-w-0">
                    <span className="font-medium text-stone-900">{o.dishName}</span> <span className="text-sm text-stone-600">{reading.diameter.words}</span>
                    {o.smallestMeetingTarget && <span className="ml-2 rounded bg-ledger-100 px-1.5 py-0.5 text-[11px] font-medium text-ledger-800">smallest meeting the target</span>}
                    {o.bestValue && <span className="ml-2 rounded bg-stone-100 px-1.5 py-0.5 text-[11px] font-medium text-stone-700">best value</span>}
                    <span className="block text-sm text-stone-700">{reading.outage.yearWords}</span>
                  </span>
                </label>
                <span className="num shrink-0 text-sm text-stone-800">{formatMoney(o.cataloguePrice)}</span>
                <label className="flex shrink-0 items-center gap-1.5 text-sm text-stone-700">
                  <input type="checkbox" name="shownOptions" value={o.index} checked={shown.has(o.index) || isChosen} disabled={isChosen} onChange={() => toggle(o.index)} className="accent-ledger-700" />
                  Show
                  {isChosen && <input type="hidden" name="shownOptions" value={o.index} />}
                </label>
              </div>
            );
          })}
        </div>
        <FormErrors names={['optionIndex', 'shownOptions', 'studyId']} />
      </fieldset>
      <TermsFields priceKey={String(chosen)} d={{ ...defaults, hardwarePrice: chosenOption.hardwarePrice, labourPrice: chosenOption.labourPrice }} />
      <div className="flex items-center gap-3">
        <SubmitButton pendingLabel="Saving…">Save draft quote</SubmitButton>
        <p className="text-sm text-stone-600">Nothing is sent yet: you can share or e-mail it from the next page.</p>
      </div>
      <NavigateOnSuccess />
    </ActionForm>
  );
}
