import { AVAILABILITY_MARK, availabilityRounding, outageQualifier } from './qualifier';
import type { BasisFigures } from './basis';
import { roundToPlaces } from './rounding';

/** Availability is written to three decimals (99.951 %): the step targets are set in. */
const AVAILABILITY_PLACES = 3;

type AvailabilityFigures = Pick<BasisFigures, 'closes' | 'availabilityPercent' | 'outageBound' | 'isUpperBound'>;

/**
 * The availability number as the rule rounds it, without sign or unit: "99.951". Rounded down, so
 * it never reaches 100 or passes a target the figure does not (a target of 99.95 reads as met
 * exactly when the figure is ≥ 99.95); an upper bound ("less than") is rounded up.
 *
 * @example availabilityNumber({ closes: true, availabilityPercent: 99.99949, outageBound: 'none', isUpperBound: false }) // => '99.999'
 */
export function availabilityNumber(f: AvailabilityFigures): string {
  return roundToPlaces(f.availabilityPercent, AVAILABILITY_PLACES, availabilityRounding(outageQualifier(f))).toFixed(AVAILABILITY_PLACES);
}

/** For a table cell: "99.951 %", "> 99.999 %", "< 95.000 %", "≥ 99.950 %" (two-way); "—" when the dish never works. */
export function availabilityText(f: AvailabilityFigures): string {
  if (!f.closes) return '—';
  return `${AVAILABILITY_MARK[outageQualifier(f)]}${availabilityNumber(f)} %`;
}

const AVAILABILITY_WORDS = { about: '', 'at-most-about': 'at least ', 'less-than': 'more than ', 'more-than': 'less than ' } as const;

/**
 * For sentences: "99.951 % of an average year", "more than 99.999 % of an average year".
 *
 * @example availabilityWords({ closes: true, availabilityPercent: 95, outageBound: 'above-model-range', isUpperBound: false }) // => 'less than 95.000 % of an average year'
 */
export function availabilityWords(f: AvailabilityFigures): string {
  if (!f.closes) return 'none: the service cannot be received with this dish';
  return `${AVAILABILITY_WORDS[outageQualifier(f)]}${availabilityNumber(f)} % of an average year`;
}
