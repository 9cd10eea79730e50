import type { ExceedanceBound } from '@/server/engine/p618-rain-path';
import { MINUTES_PER_YEAR } from '@/server/engine/physical-constants';
import type { TradeoffOption, TradeoffRecommendation } from '@/server/engine/tradeoff-types';

export type OptionBasis = TradeoffRecommendation['basis'];

/**
 * The figures an option is judged on, whether read from a stored study or from the copy a quote
 * keeps: its outage on the study's basis and whether it works there at all.
 */
export interface BasisFigures {
  /** False when the dish does not receive (or, two-way, send) the service even in clear sky. */
  closes: boolean;
  outagePercent: number;
  /** 'below-model-range': the outage is an upper bound; 'above-model-range': a lower bound (ITU-R P.618-14 range 0.001–5 %). */
  outageBound: ExceedanceBound;
  availabilityPercent: number;
  outageMinutesPerYear: number;
  worstMonthOutageMinutes: number;
  /** A two-way figure (p_up + p_down) is itself an upper bound on the true outage (server/engine/README.md §4). */
  isUpperBound: boolean;
}

/**
 * Whether the option works on the basis: the downlink closes and, for a two-way service, the
 * uplink too. An uplink we know nothing about is not taken to work.
 */
export function closesOnBasis(option: Pick<TradeoffOption, 'closes' | 'uplink'>, basis: OptionBasis): boolean {
  return option.closes && (basis !== 'two-way' || (option.uplink?.closes ?? false));
}

/**
 * The outage an option is judged on: the two-way sum when the study has an uplink (the engine's
 * recommendation basis, server/engine/README.md §4–§5), else the downlink.
 *
 * @example basisFiguresOf(option, 'downlink').outageMinutesPerYear === option.outageMinutesPerYear // => true
 */
export function basisFiguresOf(option: TradeoffOption, basis: OptionBasis): BasisFigures {
  const twoWay = basis === 'two-way' && option.twoWay !== null;
  const f = twoWay && option.twoWay ? option.twoWay : option;
  return {
    closes: closesOnBasis(option, basis),
    outagePercent: f.outagePercent,
    outageBound: f.outageBound,
    availabilityPercent: f.availabilityPercent,
    outageMinutesPerYear: f.outageMinutesPerYear,
    worstMonthOutageMinutes: f.worstMonthOutageMinutes,
    isUpperBound: twoWay,
  };
}

/**
 * Meets the target only when that is known: a dish that does not close, an option without a
 * target (null) or one the engine could not judge never reads as meeting it.
 */
export function meetsTarget(closes: boolean, knownToMeet: boolean | null | undefined): boolean {
  return closes && knownToMeet === true;
}

/** Outage minutes a year that a target availability allows (525 960 min in an average year, server/engine/README.md §4); null without a target. */
export function allowedMinutesPerYear(targetPercent: number | null): number | null {
  return targetPercent === null ? null : ((100 - targetPercent) / 100) * MINUTES_PER_YEAR;
}
