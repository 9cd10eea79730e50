import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { LinkButton } from '@/components/ui/button';
import Decimal from 'decimal.js';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { formatCostPerMinute, formatMoney } from '@/server/money-format';
import { readStudyOption, savedMinutesNumber } from '@/server/study-option';
import { fixed } from './format';
import { quoteHref } from './options-table';

/**
 * "It costs $120.00 more than the 60 cm dish and cuts the outage by 390 minutes a year: $0.307 of
 * extra price for each minute a year it cuts." The engine's cost per minute saved, in words.
 */
export function bestValueWords(t: TradeoffResult, i: number): string {
  const o = t.options[i];
  const base = t.options[t.recommendation.baselineIndex];
  const baseCm = readStudyOption(t, t.recommendation.baselineIndex).diameter.cm;
  const saved = `cuts the outage by ${savedMinutesNumber(o.minutesSavedPerYear)} minutes a year`;
  if (o.priceUsd === null || base.priceUsd === null) return `Against the ${baseCm} dish it ${saved}.`;
  const extra = new Decimal(o.priceUsd).minus(base.priceUsd);
  return `It costs ${formatMoney(extra.toFixed(2))} more than the ${baseCm} dish and ${saved}: ${formatCostPerMinute(o.costPerMinuteSavedUsd)} of extra price for each minute a year it cuts.`;
}

/** The answer in three lines: the smallest dish meeting the target, the best value, and where more size stops paying. */
export function Recommendation({ studyId, inputs, result, canQuote }: { studyId: number; inputs: StudyInputsSnapshot; result: StudyResultSnapshot; canQuote: boolean }) {
  // Unique per use: a study comparing services shows this once per service.
  const uid = useId();
  const t = result.tradeoff;
  const rec = t.recommendation;
  const name = (i: number) => `${inputs.dishes[i]?.name ?? ''} (${readStudyOption(t, i).diameter.cm})`.trim();
  const smallest = rec.smallestMeetingTargetIndex;
  const quoteIndex = smallest ?? rec.bestValueIndex ?? rec.diminishingReturnsIndex;
  return (
    <section aria-labelledby={`recommendation-title-${uid}`} className="rounded-md border border-ledger-200 bg-ledger-50/50 px-4 py-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0 space-y-2 text-sm text-stone-800">
          <h2 id={`recommendation-title-${uid}`} className="text-base font-semibold text-stone-900">
            Recommendation
          </h2>
          <p>
            {smallest !== null ? (
              <>
                <strong>{name(smallest)}</strong> is the smallest dish meeting the target of {fixed(rec.targetAvailabilityPercent ?? 0, 3)} %
                {rec.basis === 'two-way' ? ' (two-way, an upper-bound outage)' : ''}: {readStudyOption(t, smallest).outage.phrase} of outage a year, for {formatMoney(t.options[smallest].priceUsd)}.
              </>
            ) : (
              <>No dish of this study meets the target of {fixed(rec.targetAvailabilityPercent ?? 0, 3)} %. Consider a larger dish, or discuss a lower target with the customer.</>
            )}
          </p>
          {rec.bestValueIndex !== null && (
            <p>
              Best value: <strong>{name(rec.bestValueIndex)}</strong>. {bestValueWords(t, rec.bestValueIndex)}
            </p>
          )}
          <p>
            Diminishing returns from <strong>{name(rec.diminishingReturnsIndex)}</strong>: compared with the {readStudyOption(t, rec.baselineIndex).diameter.cm} dish it already removes at least 90 % of the outage minutes that the largest dish of this study would remove. Larger dishes cost more for little further gain (our rule of thumb: the first dish reaching 90 % of the largest saving).
          </p>
        </div>
        {canQuote && (
          <LinkButton href={quoteHref(studyId, quoteIndex)} className="shrink-0 print:hidden">
            Create quote
          </LinkButton>
        )}
      </div>
    </section>
  );
}
