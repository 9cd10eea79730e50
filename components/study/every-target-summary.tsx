import { smallestDishMeetingEveryTarget, type ServiceSection } from '@/server/studies/comparison';
import { diameterLabel, readStudyOption } from '@/server/study-option';
import { formatMoney } from '@/server/money-format';
import { fixed } from './format';

/**
 * The answer of a study comparing services: the smallest dish that meets every service's target
 * (each on its own basis), or that none does, with each service's own smallest dish beside it.
 */
export function EveryTargetSummary({ sections }: { sections: ServiceSection[] }) {
  const verdict = smallestDishMeetingEveryTarget(sections);
  const target = sections[0]?.inputs.targetAvailabilityPercent ?? 0;
  const first = sections[0];
  const price = verdict.dish ? first.result.tradeoff.options[verdict.dish.optionIndexes[0]]?.priceUsd : null;
  return (
    <section aria-labelledby="every-target-title" className="rounded-md border border-ledger-200 bg-ledger-50/50 px-4 py-4 text-sm text-stone-800">
      <h2 id="every-target-title" className="text-base font-semibold text-stone-900">
        One dish for every service
      </h2>
      <p className="mt-2">
        {verdict.dish ? (
          <>
            <strong>
              {verdict.dish.name} ({diameterLabel(verdict.dish.diameterM).cm})
            </strong>{' '}
            is the smallest dish of this study that meets the target of {fixed(target, 3)} % for {sections.length === 2 ? 'both services' : `all ${sections.length} services`}{price ? `, for ${formatMoney(price)}` : ''}.
          </>
        ) : (
          <>
            <strong>No dish of this study meets the target of {fixed(target, 3)} % for every service.</strong> Consider a larger dish, a lower target, or
            dropping a service.
          </>
        )}
      </p>
      <ul className="mt-2 space-y-1" aria-label="Smallest dish per service">
        {sections.map((s, i) => {
          const idx = verdict.smallestPerService[i];
          const outage = verdict.dish ? readStudyOption(s.result.tradeoff, verdict.dish.optionIndexes[i]).outage.phrase : null;
          return (
            <li key={i}>
              {s.inputs.service.name}
              {s.result.tradeoff.recommendation.basis === 'two-way' ? ' (two-way)' : ''}:{' '}
              {idx === null ? 'no dish of the study meets the target' : `${s.inputs.dishes[idx]?.name ?? ''} (${diameterLabel(s.result.tradeoff.options[idx].diameterM).cm}) is its smallest`}
              {outage ? `; with the common dish, ${outage} of outage a year` : ''}.
            </li>
          );
        })}
      </ul>
      <p className="mt-2 text-xs text-stone-600">Predictions are long-term statistical averages (ITU-R methods), not guarantees for any one year.</p>
    </section>
  );
}
