import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { LinkButton } from '@/components/ui/button';
import { formatCostPerMinute, formatMoney } from '@/server/money-format';
import { readStudyOption } from '@/server/study-option';
import { fixed } from './format';
import { quoteHref } from './options-table';

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
              Best value per minute saved: <strong>{name(rec.bestValueIndex)}</strong>, {formatCostPerMinute(t.options[rec.bestValueIndex].costPerMinuteSavedUsd)} for each minute a year saved against the {readStudyOption(t, rec.baselineIndex).diameter.cm} dish.
            </p>
          )}
          <p>
            Diminishing returns from <strong>{name(rec.diminishingReturnsIndex)}</strong>: it already saves 90 % of what the largest dish of the study would (FadeLedger convention).
          </p>
        </div>
        {canQuote && (
          <LinkButton href={quoteHref(studyId, quoteIndex)} className="shrink-0">
            Create quote
          </LinkButton>
        )}
      </div>
    </section>
  );
}
