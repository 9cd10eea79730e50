import type { OutageFigures } from '@/server/engine/outage-figures';
import type { TradeoffOption, TradeoffResult } from '@/server/engine/tradeoff-types';

/**
 * The outage a row is judged on: the two-way sum when the study has an uplink (the engine's
 * recommendation basis), else the downlink. A dish that does not close has no outage figure.
 */
export function basisFigures(option: TradeoffOption, basis: TradeoffResult['recommendation']['basis']): OutageFigures {
  return basis === 'two-way' && option.twoWay ? option.twoWay : option;
}

/** Closes on the basis: the downlink, and for a two-way service the uplink too. */
export function closesOnBasis(option: TradeoffOption, basis: TradeoffResult['recommendation']['basis']): boolean {
  return option.closes && (basis !== 'two-way' || (option.uplink?.closes ?? false));
}

/** Outage minutes a year that the target availability allows (525 960 min in an average year, server/engine/README.md §4). */
export function allowedMinutes(targetPercent: number | null): number | null {
  return targetPercent === null ? null : ((100 - targetPercent) / 100) * 525_960;
}
