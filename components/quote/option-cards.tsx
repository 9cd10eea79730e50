import type { QuoteOptionSnapshot } from '@/server/quotes/snapshot';
import { presentOptions } from '@/server/quotes/present';
import { formatMoney } from '@/server/money-format';

/**
 * The options in plain words, small dish to large, the quoted one marked as the recommendation.
 * Used on the customer's page and, as a preview, on the team's quote page.
 */
export function OptionCards({ options, chosenIndex, currency, headingLevel = 3 }: { options: QuoteOptionSnapshot[]; chosenIndex: number; currency: string; headingLevel?: 2 | 3 }) {
  const presented = presentOptions(options, chosenIndex);
  const H = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3">
      {presented.map((p) => (
        <li key={p.option.index} className={`flex flex-col rounded-md border bg-white p-4 ${p.quoted ? 'border-ledger-600 ring-1 ring-ledger-600' : 'border-stone-200'}`} aria-label={p.quoted ? `${p.label}, recommended` : p.label}>
          <div className="flex items-start justify-between gap-3">
            <div>
              <H className="font-semibold text-stone-900">{p.label}</H>
              <p className="text-sm text-stone-600">{p.reading.diameter.words} dish</p>
            </div>
            {p.quoted && <span className="shrink-0 rounded bg-ledger-700 px-2 py-0.5 text-xs font-semibold text-white">Recommended</span>}
          </div>
          <p className="mt-3 text-[15px] leading-snug text-stone-900">{p.reading.outage.yearWords}</p>
          {p.reading.worstMonth.words && <p className="mt-1 text-sm text-stone-700">{p.reading.worstMonth.words}</p>}
          <p className="mt-1 text-sm text-stone-700">Signal available {p.reading.availability.words}.</p>
          {p.saving && <p className="mt-1 text-sm text-ledger-800">{p.saving}</p>}
          {p.option.mountNotes && <p className="mt-2 text-xs text-stone-600">Mounting: {p.option.mountNotes}</p>}
          <p className="mt-auto pt-3 text-sm text-stone-700">
            Dish and fitting <span className="num float-right font-medium text-stone-900">{formatMoney(p.option.cataloguePrice, currency)}</span>
          </p>
        </li>
      ))}
    </ul>
  );
}
