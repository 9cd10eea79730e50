import { MINUTES_PER_MONTH, MINUTES_PER_YEAR } from './physical-constants';
import type { ExceedanceBound } from './p618-rain-path';
import { worstMonthPercentUnchecked } from './p841-worst-month';

/** Outage of one link expressed the ways a quote needs. */
export interface OutageFigures {
  /**
   * Percentage of an average year the link is out, %. With `outageBound`:
   * 'none' → the value; 'below-model-range' → an UPPER bound (0.001: "less than 0.001 %");
   * 'above-model-range' → a LOWER bound (5: "more than 5 %"). A link that does not close is
   * 100 with bound 'none' (it never works).
   */
  outagePercent: number;
  outageBound: ExceedanceBound;
  /** 100 − outagePercent; a lower bound (">99.999") when 'below-model-range', an upper bound ("<95") when 'above-model-range'. */
  availabilityPercent: number;
  /** outagePercent/100 × 525 960 min (server/engine/README.md §4); bounded like outagePercent. */
  outageMinutesPerYear: number;
  /** ITU-R P.841 worst-month percentage p_w, %; bounded like outagePercent. */
  worstMonthOutagePercent: number;
  /** p_w/100 × 43 830 min (server/engine/README.md §4); bounded like outagePercent. */
  worstMonthOutageMinutes: number;
}

/**
 * Turn an annual outage percentage and its bound into availability, minutes per year and
 * worst-month minutes (server/engine/README.md §4; worst month by ITU-R P.841, see worstMonthPercent).
 *
 * Bad input: callers pass 0 ≤ p ≤ 100 from the engine itself; nothing is validated here.
 *
 * @example
 * outageFigures(0.01, 'none').outageMinutesPerYear // => 52.596
 */
export function outageFigures(pPercent: number, bound: ExceedanceBound): OutageFigures {
  const pw = worstMonthPercentUnchecked(pPercent);
  return {
    outagePercent: pPercent,
    outageBound: bound,
    availabilityPercent: 100 - pPercent,
    outageMinutesPerYear: (pPercent / 100) * MINUTES_PER_YEAR,
    worstMonthOutagePercent: pw,
    worstMonthOutageMinutes: (pw / 100) * MINUTES_PER_MONTH,
  };
}

/** The figures of a link that does not close in clear sky: out 100 % of the time. */
export const NEVER_WORKS: Readonly<OutageFigures> = Object.freeze(outageFigures(100, 'none'));
