import { OUTAGE_MARK, outageRounding, type OutageQualifier } from './qualifier';
import { roundToPlaces } from './rounding';

/** Decimals for a share of the year: two significant digits below 0.01 %, else 3 below 1 %, else 2. */
function placesFor(percent: number): number {
  if (percent > 0 && percent < 0.01) return Math.min(10, 1 - Math.floor(Math.log10(percent)));
  return percent < 1 ? 3 : 2;
}

/**
 * The outage as a share of an average year, rounded by the rule and signed by its qualifier.
 *
 * Bad input: a negative, NaN or infinite percentage throws RangeError.
 *
 * @example outagePercentText(0.02134, 'about') // => '0.022 %'
 * @example outagePercentText(0.001, 'less-than') // => '< 0.0010 %'
 */
export function outagePercentText(percent: number, q: OutageQualifier): string {
  if (!Number.isFinite(percent) || percent < 0) throw new RangeError(`an outage share must be a finite percentage ≥ 0; got ${percent}`);
  const places = placesFor(percent);
  return `${OUTAGE_MARK[q]}${roundToPlaces(percent, places, outageRounding(q)).toFixed(places)} %`;
}
