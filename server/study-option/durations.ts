import { amountCell, amountText, roundedAmount, type RoundedFigure, type RoundingDirection } from './rounding';
import { OUTAGE_MARK, outageRounding, type OutageQualifier } from './qualifier';

/**
 * Durations (outage, worst month, minutes saved) in one rule for tables, words and files:
 * rounded by server/study-option/rounding.ts, in minutes below an hour, in hours below two days,
 * in days beyond (our own readability choice, no source).
 */

const MINUTES_PER_HOUR = 60;
const MINUTES_PER_DAY = 1440;
/** From two days on, days read better than hours (our own choice, no source). */
const HOURS_BEFORE_DAYS = 48;

type DurationUnit = 'minute' | 'hour' | 'day';

export interface RoundedDuration extends RoundedFigure {
  unit: DurationUnit;
}

const SHORT: Record<DurationUnit, string> = { minute: 'min', hour: 'h', day: 'd' };

function requireMinutes(minutes: number): void {
  if (!Number.isFinite(minutes) || minutes < 0) throw new RangeError(`a duration must be a finite number of minutes ≥ 0; got ${minutes}`);
}

/**
 * A duration in the unit that reads best after rounding (so 59.96 min up is "1 hour", never "60 minutes").
 *
 * Bad input: a negative, NaN or infinite number of minutes throws RangeError.
 *
 * @example roundedDuration(257.2, 'up') // => { value: 4.3, places: 1, unit: 'hour' }
 */
export function roundedDuration(minutes: number, direction: RoundingDirection): RoundedDuration {
  requireMinutes(minutes);
  const inMinutes = roundedAmount(minutes, direction);
  if (inMinutes.value < MINUTES_PER_HOUR) return { ...inMinutes, unit: 'minute' };
  const inHours = roundedAmount(minutes / MINUTES_PER_HOUR, direction);
  if (inHours.value < HOURS_BEFORE_DAYS) return { ...inHours, unit: 'hour' };
  return { ...roundedAmount(minutes / MINUTES_PER_DAY, direction), unit: 'day' };
}

/** "4.3 h", "45 min", "18 d". */
export function durationShort(d: RoundedDuration): string {
  return `${amountText(d)} ${SHORT[d.unit]}`;
}

/** "4.3 hours", "1 minute". */
export function durationLong(d: RoundedDuration): string {
  return `${amountText(d)} ${d.unit}${d.value === 1 ? '' : 's'}`;
}

/**
 * Minutes kept in minutes, rounded by the rule, for a column whose header names the unit.
 *
 * @example minutesNumber(26297.6, 'up') // => '26,298'
 */
export function minutesNumber(minutes: number, direction: RoundingDirection): string {
  requireMinutes(minutes);
  return amountText(roundedAmount(minutes, direction));
}

/** "258 min". */
export function minutesText(minutes: number, direction: RoundingDirection): string {
  return `${minutesNumber(minutes, direction)} min`;
}

/** The same minutes for a CSV cell: "258", "5.3", no grouping. */
export function minutesCell(minutes: number, direction: RoundingDirection): string {
  requireMinutes(minutes);
  return amountCell(roundedAmount(minutes, direction));
}

/** An outage in minutes with its sign, no unit: "< 5.3", "≤ 258". */
export function outageMinutesNumber(minutes: number, q: OutageQualifier): string {
  return `${OUTAGE_MARK[q]}${minutesNumber(minutes, outageRounding(q))}`;
}

/** An outage in minutes with its sign: "< 5.3 min", "≤ 258 min". */
export function outageMinutesText(minutes: number, q: OutageQualifier): string {
  return `${outageMinutesNumber(minutes, q)} min`;
}

/**
 * Minutes saved a year against the smallest dish. A saving is good news, so it rounds down; a
 * bigger dish that loses minutes (a negative saving) shows the loss rounded up.
 *
 * @example savedMinutesNumber(512.33) // => '512'
 */
export function savedMinutesNumber(minutes: number): string {
  if (!Number.isFinite(minutes)) throw new RangeError(`minutes saved must be a finite number; got ${minutes}`);
  return minutes < 0 ? `−${amountText(roundedAmount(-minutes, 'up'))}` : amountText(roundedAmount(minutes, 'down'));
}

/** The same saving for a CSV cell ("512", "-3.2"). */
export function savedMinutesCell(minutes: number): string {
  if (!Number.isFinite(minutes)) throw new RangeError(`minutes saved must be a finite number; got ${minutes}`);
  return minutes < 0 ? `-${amountCell(roundedAmount(-minutes, 'up'))}` : amountCell(roundedAmount(minutes, 'down'));
}

/**
 * An outage duration in words, as sure as its figure.
 *
 * @example outageDurationWords(257.2, 'about') // => 'about 4.3 hours'
 * @example outageDurationWords(5.2596, 'less-than') // => 'less than 5.3 minutes'
 */
export function outageDurationWords(minutes: number, q: OutageQualifier): string {
  const d = roundedDuration(minutes, outageRounding(q));
  if (d.value === 0) return 'no time';
  const long = durationLong(d);
  switch (q) {
    case 'about':
      return `about ${long}`;
    case 'at-most-about':
      return `at most about ${long}`;
    case 'less-than':
      return `less than ${long}`;
    case 'more-than':
      return `more than ${long}`;
  }
}
