import Link from 'next/link';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { formatCostPerMinute, formatMoney } from '@/server/money-format';
import { dishName, readStudyOption, savedMinutesNumber } from '@/server/study-option';
import { fixed } from './format';

/** The quote screen takes the study and the option (index into `options`). */
export function quoteHref(studyId: number, optionIndex: number): string {
  return `/quotes/new?study=${studyId}&option=${optionIndex}`;
}

function Tag({ children }: { children: string }) {
  return <span className="ml-1 inline-block rounded bg-ledger-50 px-1.5 py-0.5 text-[11px] font-medium text-ledger-800">{children}</span>;
}

/** One row per dish: the link budget, the fade threshold, the outage and the money, small to large. */
export function OptionsTable({ studyId, inputs, result, canQuote }: { studyId: number; inputs: StudyInputsSnapshot; result: StudyResultSnapshot; canQuote: boolean }) {
  const t = result.tradeoff;
  const rec = t.recommendation;
  const twoWay = rec.basis === 'two-way';
  const hasUplink = t.options.some((o) => o.uplink !== null);
  const hasAcm = t.options.some((o) => o.acm !== null);
  return (
    <Table caption="Trade-off per dish">
      <THead>
        <tr>
          <Th className="sticky left-0 z-[1] bg-stone-50">Dish</Th>
          <Th numeric className="normal-case">Gain dBi</Th>
          <Th numeric className="normal-case">G/T dB/K</Th>
          <Th numeric className="normal-case">Clear-sky Es/N0 dB</Th>
          <Th numeric className="normal-case">Margin dB</Th>
          {hasUplink && <Th numeric className="normal-case">Uplink margin dB</Th>}
          {hasAcm && <Th numeric className="normal-case">ACM expected Mbit/s</Th>}
          <Th numeric className="normal-case">Fade threshold dB</Th>
          <Th numeric className="normal-case">Availability{twoWay ? ' (two-way)' : ''}</Th>
          <Th numeric className="normal-case">Outage / year</Th>
          <Th numeric className="normal-case">Worst month</Th>
          <Th numeric className="normal-case">Price</Th>
          <Th numeric className="normal-case">Minutes saved / yr</Th>
          <Th numeric className="normal-case">Cost per minute saved</Th>
          {canQuote && <Th>
            <span className="sr-only">Quote</span>
          </Th>}
        </tr>
      </THead>
      <TBody>
        {t.options.map((o, i) => {
          const dish = inputs.dishes[i];
          const reading = readStudyOption(t, i);
          const size = reading.diameter;
          const closes = reading.closes;
          return (
            <tr key={o.index} className={rec.smallestMeetingTargetIndex === i ? 'bg-ledger-50' : undefined}>
              <Th scope="row" className={`sticky left-0 z-[1] whitespace-nowrap align-top font-normal ${rec.smallestMeetingTargetIndex === i ? 'bg-ledger-50' : 'bg-white'}`}>
                <span className="block font-medium text-stone-900">{dishName(dish?.name, o.diameterM)}</span>
                <span className="num block text-left text-xs text-stone-600">
                  {size.cm} <span className="text-stone-600">({size.inches})</span>
                </span>
                {rec.smallestMeetingTargetIndex === i && <Tag>meets target</Tag>}
                {rec.bestValueIndex === i && <Tag>best value</Tag>}
                {rec.diminishingReturnsIndex === i && <Tag>diminishing returns</Tag>}
              </Th>
              <Td numeric>{fixed(o.gainDbi, 1)}</Td>
              <Td numeric>{fixed(o.gOverTDbK, 1)}</Td>
              <Td numeric>{fixed(o.clearSkyEsN0Db, 2)}</Td>
              <Td numeric className={o.marginDb <= 0 ? 'text-red-700' : ''}>{fixed(o.marginDb, 2)}</Td>
              {hasUplink && <Td numeric className={o.uplink && o.uplink.marginDb <= 0 ? 'text-red-700' : ''}>{o.uplink ? fixed(o.uplink.marginDb, 2) : '—'}</Td>}
              {hasAcm && (
                <Td numeric className="whitespace-nowrap">
                  {o.acm ? `${o.acm.modelRangeLimited ? '≤ ' : ''}${fixed(o.acm.expectedThroughputMbps, 1)}` : '—'}
                  {o.acm?.clearSkyModcod && <span className="block text-xs text-stone-600">clear sky {o.acm.clearSkyModcod}</span>}
                </Td>
              )}
              {closes ? (
                <>
                  <Td numeric>{o.fadeThresholdDb === null ? '—' : fixed(o.fadeThresholdDb, 2)}</Td>
                  <Td numeric className="whitespace-nowrap">{reading.availability.text}</Td>
                  <Td numeric className="whitespace-nowrap">
                    {reading.outage.minutesText}
                    {reading.outage.durationText !== reading.outage.minutesText && <span className="block text-xs text-stone-600">{reading.outage.durationText}</span>}
                  </Td>
                  <Td numeric className="whitespace-nowrap">{reading.worstMonth.minutesText}</Td>
                </>
              ) : (
                <Td colSpan={4} className="text-sm text-red-700">
                  Does not close{o.closes ? ' on the uplink' : ''}: short by {fixed(-(o.closes && o.uplink ? o.uplink.marginDb : o.marginDb), 2)} dB even in clear sky. It never works with this carrier.
                </Td>
              )}
              <Td numeric className="whitespace-nowrap">{formatMoney(o.priceUsd)}</Td>
              <Td numeric>{i === rec.baselineIndex ? <span className="text-stone-600">baseline</span> : savedMinutesNumber(o.minutesSavedPerYear)}</Td>
              <Td numeric>{formatCostPerMinute(o.costPerMinuteSavedUsd)}</Td>
              {canQuote && (
                <Td className="whitespace-nowrap">
                  {closes ? (
                    <Link href={quoteHref(studyId, i)} className="text-sm font-medium text-ledger-700 underline-offset-2 hover:underline">
                      Quote<span className="sr-only"> the {size.cm} dish</span>
                    </Link>
                  ) : null}
                </Td>
              )}
            </tr>
          );
        })}
      </TBody>
    </Table>
  );
}
