import type { BasisFigures } from './basis';
import type { RoundingDirection } from './rounding';

/**
 * How sure an outage figure is, and so how it is said:
 * - 'about': the model's estimate;
 * - 'at-most-about': a two-way sum p_up + p_down, an upper bound on the truth (server/engine/README.md §4);
 * - 'less-than': below the ITU-R P.618-14 range (0.001 %), an upper bound;
 * - 'more-than': above the range (5 %), a lower bound.
 * The model-range bound wins over the two-way sum: it is the stronger statement.
 */
export type OutageQualifier = 'about' | 'at-most-about' | 'less-than' | 'more-than';

export function outageQualifier(f: Pick<BasisFigures, 'outageBound' | 'isUpperBound'>): OutageQualifier {
  if (f.outageBound === 'below-model-range') return 'less-than';
  if (f.outageBound === 'above-model-range') return 'more-than';
  return f.isUpperBound ? 'at-most-about' : 'about';
}

/** Outages round up, except a lower bound, which rounds down so that "more than" stays true. */
export function outageRounding(q: OutageQualifier): RoundingDirection {
  return q === 'more-than' ? 'down' : 'up';
}

/** Availability is 100 − outage: it rounds down, except when it is an upper bound ("less than"). */
export function availabilityRounding(q: OutageQualifier): RoundingDirection {
  return q === 'more-than' ? 'up' : 'down';
}

/** The sign written before an outage figure in a table cell. */
export const OUTAGE_MARK: Record<OutageQualifier, string> = { about: '', 'at-most-about': '≤ ', 'less-than': '< ', 'more-than': '> ' };
/** The sign before an availability figure: the outage's bound turned round. */
export const AVAILABILITY_MARK: Record<OutageQualifier, string> = { about: '', 'at-most-about': '≥ ', 'less-than': '> ', 'more-than': '< ' };
