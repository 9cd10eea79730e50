import { EngineInputError } from '../engine/errors';

/** The percentages of the year tabulated by the ITU-R P.836-6 and P.840-8 maps. */
export const TABULATED_P_PERCENT: readonly number[] = Object.freeze([0.1, 0.2, 0.3, 0.5, 1, 2, 3, 5, 10, 20, 30, 50, 60, 70, 80, 90, 95, 99]);

const LN_TABULATED_P = TABULATED_P_PERCENT.map(Math.log);

/** Where p sits among the tabulated p: indices of the two maps around it and the fraction in ln p. */
export interface LogPBracket {
  lower: number;
  upper: number;
  /** 0 at TABULATED_P_PERCENT[lower], 1 at [upper]; 0 with lower = upper when p is tabulated. */
  t: number;
}

/**
 * The bracket of p for interpolation linear in ln p (Rec. ITU-R P.836-6 and P.840-8). p outside
 * 0.1…99 % is refused: the maps say nothing there, and holding a value is the caller's decision.
 *
 * @example
 * logPBracket(0.15) // => { lower: 0, upper: 1, t: 0.5849… }
 * logPBracket(1)    // => { lower: 4, upper: 4, t: 0 }
 */
export function logPBracket(pPercent: number): LogPBracket {
  const first = TABULATED_P_PERCENT[0];
  const last = TABULATED_P_PERCENT[TABULATED_P_PERCENT.length - 1];
  if (typeof pPercent !== 'number' || !Number.isFinite(pPercent) || pPercent < first || pPercent > last) {
    throw new EngineInputError(
      'pPercent',
      `must be from ${first} to ${last} % (the range tabulated by the ITU-R P.836-6 and P.840-8 maps); got ${pPercent}`,
      pPercent,
    );
  }
  let upper = 0;
  while (TABULATED_P_PERCENT[upper] < pPercent) upper++;
  if (TABULATED_P_PERCENT[upper] === pPercent) return { lower: upper, upper, t: 0 };
  const lower = upper - 1;
  const t = (Math.log(pPercent) - LN_TABULATED_P[lower]) / (LN_TABULATED_P[upper] - LN_TABULATED_P[lower]);
  return { lower, upper, t };
}

/**
 * Value at p from the values at the bracket's two tabulated p (`upperValue` is ignored when p is tabulated).
 *
 * @example
 * betweenTabulated({ lower: 0, upper: 1, t: 0.5 }, 4, 2) // => 3
 */
export function betweenTabulated(bracket: LogPBracket, lowerValue: number, upperValue: number): number {
  return bracket.t === 0 ? lowerValue : lowerValue + bracket.t * (upperValue - lowerValue);
}
