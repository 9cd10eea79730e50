/**
 * The one rounding rule for computed figures: a figure is cut to the digits it is shown with in
 * the direction that never claims more than it supports. An outage (or any bad thing) is rounded
 * up, an availability (or a saving) down; a lower bound ("more than …") is rounded down and an
 * upper bound ("less than …") up, so the words stay true. Pure; no I/O, no framework.
 */

export type RoundingDirection = 'up' | 'down';

/**
 * A hair of tolerance in units of the last digit shown: 1.005 × 1000 is 1004.9999999999999 in
 * binary floating point and must still read 1.005. A few hundred float steps (1e-12 of a percent
 * at three decimals), far below anything the engine resolves.
 */
const HAIR_OF_LAST_DIGIT = 1e-9;

/**
 * `value` rounded to `places` decimals in `direction`.
 *
 * Bad input: a value that is not finite, or places outside 0–10, throws RangeError.
 *
 * @example roundToPlaces(99.99949, 3, 'down') // => 99.999
 * @example roundToPlaces(5.2596, 1, 'up') // => 5.3
 */
export function roundToPlaces(value: number, places: number, direction: RoundingDirection): number {
  if (!Number.isFinite(value)) throw new RangeError(`a figure to round must be a finite number; got ${value}`);
  if (!Number.isInteger(places) || places < 0 || places > 10) throw new RangeError(`decimal places must be a whole number 0–10; got ${places}`);
  const scale = 10 ** places;
  const scaled = value * scale;
  const cut = direction === 'down' ? Math.floor(scaled + HAIR_OF_LAST_DIGIT) : Math.ceil(scaled - HAIR_OF_LAST_DIGIT);
  // + 0: ceil of a hair below zero is −0, which would print "-0".
  return cut / scale + 0;
}

/** A figure rounded by the rule, with the decimals it is written with. */
export interface RoundedFigure {
  value: number;
  places: number;
}

/**
 * Two significant digits' worth for amounts people count (minutes, hours, days): one decimal
 * below 10, whole numbers from 10 on (decided after rounding, so 9.96 up reads 10, not 10.0).
 *
 * @example roundedAmount(4.2867, 'up') // => { value: 4.3, places: 1 }
 * @example roundedAmount(257.2, 'up') // => { value: 258, places: 0 }
 */
export function roundedAmount(amount: number, direction: RoundingDirection): RoundedFigure {
  const tenths = roundToPlaces(amount, 1, direction);
  return tenths < 10 ? { value: tenths, places: 1 } : { value: roundToPlaces(amount, 0, direction), places: 0 };
}

/**
 * The figure as written: digits grouped in thousands (en-US), a trailing ".0" dropped so that
 * "4 hours" never reads "4.0 hours".
 *
 * @example amountText({ value: 26298, places: 0 }) // => '26,298'
 * @example amountText({ value: 4, places: 1 }) // => '4'
 */
export function amountText(f: RoundedFigure): string {
  const text = f.value.toLocaleString('en-US', { minimumFractionDigits: f.places, maximumFractionDigits: f.places });
  return text.replace(/\.0+$/, '');
}

/** The same figure for a data file: no grouping, a dot for decimals, trailing ".0" dropped. */
export function amountCell(f: RoundedFigure): string {
  return f.value.toFixed(f.places).replace(/\.0+$/, '');
}
