import Link from 'next/link';
import type { TradeoffOption, TradeoffResult } from '@/server/engine/tradeoff-types';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { Table, THead, Td, Th } from '@/components/ui/table';
import { formatCostPerMinute, formatMoney } from '@/server/money-format';
import { dishName, readStudyOption, savedMinutesNumber, type OptionReading } from '@/server/study-option';
import { acmSummary, type AcmSummary } from './acm-summary';
import { fixed } from './format';

/** The quote screen takes the study and the option (index into `options`). */
export function quoteHref(studyId: number, optionIndex: number): string {
  return `/quotes/new?study=${studyId}&option=${optionIndex}`;
}

function Tag({ children }: { children: string }) {
  return <span className="mr-1 mt-0.5 inline-block rounded bg-ledger-50 px-1.5 py-0.5 text-[11px] font-medium text-ledger-800 ring-1 ring-inset ring-ledger-200">{children}</span>;
}

function Tags({ t, i }: { t: TradeoffResult; i: number }) {
  const rec = t.recommendation;
  return (
    <>
      {rec.smallestMeetingTargetIndex === i && <Tag>meets target</Tag>}
      {rec.bestValueIndex === i && <Tag>best value</Tag>}
      {rec.diminishingReturnsIndex === i && <Tag>diminishing returns</Tag>}
    </>
  );
}

function shortfall(o: TradeoffOption): string {
  const onUplink = o.closes && o.uplink !== null;
  return `Does not close${onUplink ? ' on the uplink' : ''}: short by ${fixed(-(onUplink && o.uplink ? o.uplink.marginDb : o.marginDb), 2)} dB even in clear sky. It never works with this carrier.`;
}

/**
 * The figures behind the decision, in one compact line per dish: gain, G/T, clear-sky Es/N0,
 * fade threshold, uplink margin and (when it differs between dishes) the ACM throughput.
 */
function LinkBudgetLine({ o, reading, acm }: { o: TradeoffOption; reading: OptionReading; acm: AcmSummary }) {
  const items: [string, string, boolean?][] = [
    ['Gain', `${fixed(o.gainDbi, 1)} dBi`],
    ['G/T', `${fixed(o.gOverTDbK, 1)} dB/K`],
    ['Clear-sky Es/N0', `${fixed(o.clearSkyEsN0Db, 2)} dB`],
  ];
  if (reading.closes && o.fadeThresholdDb !== null) items.push(['Fade threshold', `${fixed(o.fadeThresholdDb, 2)} dB`]);
  if (o.uplink) items.push(['Uplink margin', `${fixed(o.uplink.marginDb, 2)} dB`, o.uplink.marginDb <= 0]);
  if (acm.kind === 'differs' && o.acm) {
    items.push(['ACM expected throughput', `${o.acm.modelRangeLimited ? '≤ ' : ''}${fixed(o.acm.expectedThroughputMbps, 1)} Mbit/s${o.acm.clearSkyModcod ? ` (clear sky ${o.acm.clearSkyModcod})` : ''}`]);
  }
  return (
    <dl className="flex flex-wrap gap-x-4 gap-y-0.5 text-xs text-stone-600">
      {items.map(([term, value, bad]) => (
        <div key={term} className="flex gap-1">
          <dt>{term}</dt>
          <dd className={`num ${bad ? 'text-red-700' : 'text-stone-800'}`}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** What the extra price over the smallest dish buys, in a short cell. */
function Saving({ t, i }: { t: TradeoffResult; i: number }) {
  const o = t.options[i];
  if (i === t.recommendation.baselineIndex) return <span className="font-sans text-stone-600">smallest dish</span>;
  return (
    <>
      {savedMinutesNumber(o.minutesSavedPerYear)} min
      {o.costPerMinuteSavedUsd !== null && <span className="block text-xs text-stone-600">{formatCostPerMinute(o.costPerMinuteSavedUsd)} per minute saved</span>}
    </>
  );
}

function AcmNote({ acm }: { acm: AcmSummary }) {
  if (acm.kind !== 'same') return null;
  const range = acm.minMbps.toFixed(1) === acm.maxMbps.toFixed(1) ? `${fixed(acm.maxMbps, 1)} Mbit/s` : `${fixed(acm.minMbps, 1)}–${fixed(acm.maxMbps, 1)} Mbit/s`;
  return (
    <p className="px-4 pt-3 text-xs text-stone-600 sm:px-5">
      Adaptive coding (ACM): every dish carries about {acm.upperBound ? 'at most ' : ''}{range} over an average year{acm.clearSkyModcod ? `, mostly at the clear-sky MODCOD ${acm.clearSkyModcod}` : ''}. Fades that lower the
      MODCOD are too short to change the yearly throughput, so dish size changes the outage, not the speed.
    </p>
  );
}

/**
 * One row per dish, small to large. At desktop widths every figure the installer decides by is a
 * column (margin, availability, outage, worst month, price, what the extra price saves, the quote
 * link) and the link budget sits on a compact line under each row; on a phone each dish is a card
 * with outage, price and the quote link first.
 */
export function OptionsTable({ studyId, inputs, result, canQuote }: { studyId: number; inputs: StudyInputsSnapshot; result: StudyResultSnapshot; canQuote: boolean }) {
  const t = result.tradeoff;
  const rec = t.recommendation;
  const twoWay = rec.basis === 'two-way';
  const acm = acmSummary(t.options);
  const columns = 7 + (canQuote ? 1 : 0);
  const rows = t.options.map((o, i) => ({ o, i, reading: readStudyOption(t, i), name: dishName(inputs.dishes[i]?.name, o.diameterM), highlighted: rec.smallestMeetingTargetIndex === i }));
  return (
    <>
      <div className="hidden lg:block print:block print:[&_table]:text-xs" data-testid="options-table">
        <Table caption="Trade-off per dish" className="print:overflow-visible">
          <THead>
            <tr>
              <Th>Dish</Th>
              <Th numeric className="normal-case">Margin dB</Th>
              <Th numeric className="normal-case">Availability{twoWay ? ' (two-way)' : ''}</Th>
              <Th numeric className="normal-case">Outage / year</Th>
              <Th numeric className="normal-case">Worst month</Th>
              <Th numeric className="normal-case">Price</Th>
              <Th numeric className="normal-case">
                Outage saved / yr
                <span className="block text-[11px] font-normal text-stone-600">vs smallest dish</span>
              </Th>
              {canQuote && (
                <Th className="print:hidden">
                  <span className="sr-only">Quote</span>
                </Th>
              )}
            </tr>
          </THead>
          {rows.map(({ o, i, reading, name, highlighted }) => (
            // One body per dish: its figures and its link-budget line stay together (and on one printed page).
            <tbody key={o.index} className="border-b border-stone-200 break-inside-avoid">
              <tr className={highlighted ? 'bg-ledger-50' : undefined}>
                <Th scope="row" className="align-top font-normal">
                  <span className="block font-medium text-stone-900">{name}</span>
                  <span className="num block text-left text-xs text-stone-600">
                    {reading.diameter.cm} ({reading.diameter.inches})
                  </span>
                  <Tags t={t} i={i} />
                </Th>
                <Td numeric className={o.marginDb <= 0 ? 'text-red-700' : ''}>{fixed(o.marginDb, 2)}</Td>
                {reading.closes ? (
                  <>
                    <Td numeric className="whitespace-nowrap">{reading.availability.text}</Td>
                    <Td numeric className="whitespace-nowrap">
                      {reading.outage.minutesText}
                      {reading.outage.durationText !== reading.outage.minutesText && <span className="block text-xs text-stone-600">{reading.outage.durationText}</span>}
                    </Td>
                    <Td numeric className="whitespace-nowrap">{reading.worstMonth.minutesText}</Td>
                  </>
                ) : (
                  <Td colSpan={3} className="text-sm text-red-700">
                    {shortfall(o)}
                  </Td>
                )}
                <Td numeric className="whitespace-nowrap">{formatMoney(o.priceUsd)}</Td>
                <Td numeric className="whitespace-nowrap">
                  <Saving t={t} i={i} />
                </Td>
                {canQuote && (
                  <Td className="whitespace-nowrap print:hidden">
                    {reading.closes ? (
                      <Link href={quoteHref(studyId, i)} className="text-sm font-medium text-ledger-700 underline-offset-2 hover:underline">
                        Quote<span className="sr-only"> the {reading.diameter.cm} dish</span>
                      </Link>
                    ) : null}
                  </Td>
                )}
              </tr>
              <tr className={highlighted ? 'bg-ledger-50' : undefined}>
                <td colSpan={columns} className="px-4 pb-2 pt-0 sm:px-5">
                  <LinkBudgetLine o={o} reading={reading} acm={acm} />
                </td>
              </tr>
            </tbody>
          ))}
        </Table>
      </div>
      <ul className="space-y-3 px-4 lg:hidden print:hidden" aria-label="Trade-off per dish" data-testid="options-cards">
        {rows.map(({ o, i, reading, name, highlighted }) => (
          <li key={o.index} className={`rounded-md border px-3 py-3 ${highlighted ? 'border-ledger-300 bg-ledger-50' : 'border-stone-200 bg-white'}`}>
            <div className="flex items-start justify-between gap-3">
              <div className="min-w-0">
                <h3 className="text-sm font-semibold text-stone-900">{name}</h3>
                <p className="num text-xs text-stone-600">
                  {reading.diameter.cm} ({reading.diameter.inches})
                </p>
              </div>
              {canQuote && reading.closes && (
                <Link href={quoteHref(studyId, i)} className="shrink-0 rounded-md border border-ledger-600 px-3 py-1.5 text-sm font-medium text-ledger-700 print:hidden" data-testid="card-quote">
                  Quote<span className="sr-only"> the {reading.diameter.cm} dish</span>
                </Link>
              )}
            </div>
            {reading.closes ? (
              <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
                <div data-testid="card-outage">
                  <dt className="text-xs text-stone-600">Outage / year</dt>
                  <dd className="num text-left font-semibold text-stone-900">
                    {reading.outage.minutesText}
                    {reading.outage.durationText !== reading.outage.minutesText && <span className="block text-xs font-normal text-stone-600">{reading.outage.durationText}</span>}
                  </dd>
                </div>
                <div data-testid="card-price">
                  <dt className="text-xs text-stone-600">Price</dt>
                  <dd className="num text-left font-semibold text-stone-900">{formatMoney(o.priceUsd)}</dd>
                </div>
                <div>
                  <dt className="text-xs text-stone-600">Availability{twoWay ? ' (two-way)' : ''}</dt>
                  <dd className="num text-left">{reading.availability.text}</dd>
                </div>
                <div>
                  <dt className="text-xs text-stone-600">Worst month</dt>
                  <dd className="num text-left">{reading.worstMonth.minutesText}</dd>
                </div>
                <div>
                  <dt className="text-xs text-stone-600">Margin</dt>
                  <dd className="num text-left">{fixed(o.marginDb, 2)} dB</dd>
                </div>
                <div>
                  <dt className="text-xs text-stone-600">Outage saved / yr</dt>
                  <dd className="num text-left">
                    <Saving t={t} i={i} />
                  </dd>
                </div>
              </dl>
            ) : (
              <p className="mt-2 text-sm text-red-700">
                {shortfall(o)} Price {formatMoney(o.priceUsd)}.
              </p>
            )}
            <div className="mt-1">
              <Tags t={t} i={i} />
            </div>
            <details className="mt-2">
              <summary className="cursor-pointer text-xs font-medium text-ledger-700">Link budget</summary>
              <div className="mt-1">
                <LinkBudgetLine o={o} reading={reading} acm={acm} />
              </div>
            </details>
          </li>
        ))}
      </ul>
      <AcmNote acm={acm} />
    </>
  );
}
