import type { ExceedanceBound } from '@/server/engine/p618-rain-path';

/**
 * Outage figures in the words a customer reads on the comparison page and the PDF:
 * "about 6 hours a year without signal, mostly in the heaviest storms".
 *
 * Honesty rules (the figures come from ITU-R P.618-14, which is stated for 0.001–5 % of the year):
 * - 'below-model-range' figures are upper bounds: said as "less than …", rounded UP, so the words
 *   are never smaller than the bound (0.001 % = 5.26 min → "less than 6 minutes").
 * - 'above-model-range' figures are lower bounds: "more than …", rounded DOWN.
 * - two-way figures (p_up + p_down) are upper bounds on the true outage: "at most about …".
 * - availability is never rounded up past what the figure supports.
 * Pure: no I/O, no framework.
 */

export interface OutageForWords {
  /** False when the dish does not receive the service even in clear sky. */
  closes: boolean;
  outagePercent: number;
  outageBound: ExceedanceBound;
  availabilityPercent: number;
  outageMinutesPerYear: number;
  worstMonthOutageMinutes: number;
  /** The figure is itself an upper bound on the truth (two-way p_up + p_down). */
  isUpperBound?: boolean;
}

export interface OutageInWords {
  /** One sentence about the average year. */
  year: string;
  /** One sentence about the worst month, or null when the dish does not work at all. */
  worstMonth: string | null;
  /** Availability as a short phrase, e.g. "99.932 % of an average year". */
  availability: string;
}

type Mode = 'about' | 'at-most-about' | 'less-than' | 'more-than';

const MINUTES_PER_HOUR = 60;
const MINUTES_PER_DAY = 1440;
/** Above two days a year we speak in days (our own readability choice, no source). */
const DAYS_FROM_MINUTES = 2 * MINUTES_PER_DAY;
/** Below ten hours, hours are given to the half hour. */
const HALF_HOURS_BELOW_MINUTES = 10 * MINUTES_PER_HOUR;

function unit(n: number, one: string, many: string): string {
  const text = Number.isInteger(n) ? String(n) : n.toFixed(1);
  return `${text} ${n === 1 ? one : many}`;
}

/** "about 45 minutes": nearest friendly step for the size (1 min, 5 min, ½ h, 1 h, 1 day). */
function aboutDuration(minutes: number): string {
  if (minutes < 1) return 'less than a minute';
  if (minutes < 9.5) return unit(Math.round(minutes), 'minute', 'minutes');
  if (minutes < 57.5) return unit(Math.round(minutes / 5) * 5, 'minute', 'minutes');
  if (minutes < HALF_HOURS_BELOW_MINUTES) return unit(Math.round(minutes / 30) / 2, 'hour', 'hours');
  if (minutes < DAYS_FROM_MINUTES - 30) return unit(Math.round(minutes / MINUTES_PER_HOUR), 'hour', 'hours');
  return unit(Math.round(minutes / MINUTES_PER_DAY), 'day', 'days');
}

/** Upper bound: the unit that fits, rounded up, so "less than N" stays true. */
function lessThanDuration(minutes: number): string {
  if (minutes <= 1) return 'a minute';
  if (minutes <= MINUTES_PER_HOUR) return unit(Math.ceil(minutes - 1e-9), 'minute', 'minutes');
  if (minutes <= DAYS_FROM_MINUTES) return unit(Math.ceil(minutes / MINUTES_PER_HOUR - 1e-9), 'hour', 'hours');
  return unit(Math.ceil(minutes / MINUTES_PER_DAY - 1e-9), 'day', 'days');
}

/** Lower bound: the unit that fits, rounded down, so "more than N" stays true. */
function moreThanDuration(minutes: number): string {
  if (minutes < MINUTES_PER_HOUR) return unit(Math.max(0, Math.floor(minutes + 1e-9)), 'minute', 'minutes');
  if (minutes < DAYS_FROM_MINUTES) return unit(Math.floor(minutes / MINUTES_PER_HOUR + 1e-9), 'hour', 'hours');
  return unit(Math.floor(minutes / MINUTES_PER_DAY + 1e-9), 'day', 'days');
}

/**
 * A duration in words, honest about bounds.
 *
 * @example durationInWords(360, 'about') // => 'about 6 hours'
 * @example durationInWords(5.2596, 'less-than') // => 'less than 6 minutes'
 */
export function durationInWords(minutes: number, mode: Mode): string {
  if (!Number.isFinite(minutes) || minutes < 0) throw new RangeError(`a duration must be a finite number of minutes ≥ 0; got ${minutes}`);
  switch (mode) {
    case 'less-than':
      return `less than ${lessThanDuration(minutes)}`;
    case 'more-than':
      return `more than ${moreThanDuration(minutes)}`;
    case 'at-most-about': {
      const about = aboutDuration(minutes);
      return about.startsWith('less than') ? about : `at most about ${about}`;
    }
    case 'about': {
      const about = aboutDuration(minutes);
      return about.startsWith('less than') ? about : `about ${about}`;
    }
  }
}

function modeOf(o: OutageForWords): Mode {
  if (o.outageBound === 'below-model-range') return 'less-than';
  if (o.outageBound === 'above-model-range') return 'more-than';
  return o.isUpperBound ? 'at-most-about' : 'about';
}

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

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** Floor or ceil to 3 decimals with a hair of tolerance for binary fractions (99.999 stays 99.999). */
function threeDecimals(x: number, direction: 'down' | 'up'): string {
  const scaled = direction === 'down' ? Math.floor(x * 1000 + 1e-6) : Math.ceil(x * 1000 - 1e-6);
  return (scaled / 1000).toFixed(3);
}

/**
 * Availability as a phrase, never claiming more than the figure supports.
 *
 * @example availabilityInWords({ …, availabilityPercent: 99.93151, outageBound: 'none' }) // => '99.931 % of an average year'
 */
export function availabilityInWords(o: Pick<OutageForWords, 'closes' | 'availabilityPercent' | 'outageBound' | 'isUpperBound'>): string {
  if (!o.closes) return 'none: the service cannot be received with this dish';
  if (o.outageBound === 'below-model-range') return `more than ${threeDecimals(o.availabilityPercent, 'down')} % of an average year`;
  if (o.outageBound === 'above-model-range') return `less than ${threeDecimals(o.availabilityPercent, 'up')} % of an average year`;
  const figure = threeDecimals(o.availabilityPercent, 'down');
  return o.isUpperBound ? `at least ${figure} % of an average year` : `${figure} % of an average year`;
}

/**
 * The option's outage in plain words.
 *
 * @example
 * describeOutage({ closes: true, outagePercent: 0.0685, outageBound: 'none', availabilityPercent: 99.9315,
 *   outageMinutesPerYear: 360.3, worstMonthOutageMinutes: 95.2 }).year
 * // => 'About 6 hours a year without signal, mostly in the heaviest storms.'
 */
export function describeOutage(o: OutageForWords): OutageInWords {
  if (!o.closes) {
    return {
      year: 'No usable signal at all: this dish is too small for this service even in clear sky.',
      worstMonth: null,
      availability: availabilityInWords(o),
    };
  }
  const mode = modeOf(o);
  const year = `${capitalise(durationInWords(o.outageMinutesPerYear, mode))} a year without signal, ${causeOf(o.outagePercent)}.`;
  const worstMonth = `In the worst month of a typical year: ${durationInWords(o.worstMonthOutageMinutes, mode)}.`;
  return { year, worstMonth, availability: availabilityInWords(o) };
}

/**
 * What a bigger dish buys back against the smallest one, in words, or null when it buys nothing.
 * Savings between two estimates are rounded like any "about" figure.
 *
 * @example savingInWords(300, '60 cm') // => 'About 5 hours a year more signal than the 60 cm dish.'
 */
export function savingInWords(minutesSavedPerYear: number, baselineLabel: string): string | null {
  if (!Number.isFinite(minutesSavedPerYear) || minutesSavedPerYear < 1) return null;
  return `${capitalise(durationInWords(minutesSavedPerYear, 'about'))} a year more signal than the ${baselineLabel} dish.`;
}

/** Diameter for people: "75 cm (30 in)". */
export function diameterInWords(diameterM: number): string {
  const cm = Math.round(diameterM * 100);
  const inches = Math.round((diameterM * 100) / 2.54);
  return `${cm} cm (${inches} in)`;
}
