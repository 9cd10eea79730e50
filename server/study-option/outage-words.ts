import type { BasisFigures } from './basis';
import { outageDurationWords, roundedDuration, durationLong } from './durations';
import { outageQualifier } from './qualifier';

/**
 * An option's outage in the words a customer reads: "About 4.3 hours a year without signal,
 * mostly in the heaviest storms." The figures are those of the tables, rounded by the same rule
 * (server/study-option/rounding.ts); the words say how sure they are ("about", "at most about",
 * "less than", "more than"). Predictions are statistics of an average year, never a promise.
 */

/**
 * What kind of rain takes the signal: the smaller the share of the year, the rarer (heavier)
 * the rain that does it. Thresholds are ours (common practice, no source): 0.01 % of the year is
 * the classic "heaviest storms" point of ITU-R P.837/P.618 (R0.01, A0.01).
 */
function causeOf(outagePercent: number): string {
  if (outagePercent <= 0.01) return 'only in the heaviest storms';
  if (outagePercent <= 0.1) return 'mostly in the heaviest storms';
  if (outagePercent <= 1) return 'mostly during heavy rain';
  return 'during heavy and even moderate rain';
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

type YearFigures = Pick<BasisFigures, 'closes' | 'outagePercent' | 'outageBound' | 'outageMinutesPerYear' | 'isUpperBound'>;

/**
 * One sentence about the average year.
 *
 * @example outageYearWords({ closes: true, outagePercent: 0.0489, outageBound: 'none', outageMinutesPerYear: 257.2, isUpperBound: false })
 * // => 'About 4.3 hours a year without signal, mostly in the heaviest storms.'
 */
export function outageYearWords(f: YearFigures): string {
  if (!f.closes) return 'No usable signal at all: this dish is too small for this service even in clear sky.';
  if (f.outageMinutesPerYear === 0) return 'No time without signal predicted in an average year.';
  return `${capitalise(outageDurationWords(f.outageMinutesPerYear, outageQualifier(f)))} a year without signal, ${causeOf(f.outagePercent)}.`;
}

/** One sentence about the worst month (ITU-R P.841), or null when the dish does not work at all. */
export function worstMonthWords(f: Pick<BasisFigures, 'closes' | 'outageBound' | 'worstMonthOutageMinutes' | 'isUpperBound'>): string | null {
  if (!f.closes) return null;
  return `In the worst month of a typical year: ${outageDurationWords(f.worstMonthOutageMinutes, outageQualifier(f))}.`;
}

/**
 * What a bigger dish buys back against the smallest one, or null when it buys less than a
 * minute. A saving is good news, so it rounds down: never more than the figures support.
 *
 * @example savingWords(300, '60 cm') // => 'About 5 hours a year more signal than the 60 cm dish.'
 */
export function savingWords(minutesSavedPerYear: number, baselineLabel: string): string | null {
  if (!Number.isFinite(minutesSavedPerYear) || minutesSavedPerYear < 1) return null;
  return `About ${durationLong(roundedDuration(minutesSavedPerYear, 'down'))} a year more signal than the ${baselineLabel} dish.`;
}
