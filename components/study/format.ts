import type { OutageFigures } from '@/server/engine/outage-figures';

/**
 * How the study screens write numbers: always with units, bounds spelled out ("less than",
 * "more than") and never a made-up figure for a dish that does not close.
 */
const CM_PER_INCH = 2.54;

export function diameterCm(diameterM: number): string {
  return `${Math.round(diameterM * 1000) / 10}`;
}

/** "90 cm" and "35.4 in" (1 in = 2.54 cm exactly). */
export function diameterLabel(diameterM: number): { cm: string; inches: string } {
  return { cm: `${diameterCm(diameterM)} cm`, inches: `${((diameterM * 100) / CM_PER_INCH).toFixed(1)} in` };
}

export function fixed(value: number, places: number): string {
  return value.toLocaleString('en-US', { minimumFractionDigits: places, maximumFractionDigits: places });
}

/** "<" for an upper bound (below the model range), ">" for a lower bound (above it), "" otherwise. */
export function boundMark(bound: OutageFigures['outageBound']): string {
  return bound === 'below-model-range' ? '< ' : bound === 'above-model-range' ? '> ' : '';
}

/** Availability to 3 decimals; a bounded figure keeps its direction (availability flips it). */
export function availabilityText(f: Pick<OutageFigures, 'availabilityPercent' | 'outageBound'>): string {
  const mark = f.outageBound === 'below-model-range' ? '> ' : f.outageBound === 'above-model-range' ? '< ' : '';
  return `${mark}${fixed(f.availabilityPercent, 3)} %`;
}

export function minutesText(minutes: number, bound: OutageFigures['outageBound']): string {
  return `${boundMark(bound)}${fixed(minutes, minutes < 10 ? 1 : 0)} min`;
}

export function hoursText(minutes: number, bound: OutageFigures['outageBound']): string {
  return `${boundMark(bound)}${fixed(minutes / 60, minutes < 600 ? 1 : 0)} h`;
}

export function usd(amount: string | number | null): string {
  if (amount === null) return '—';
  return Number(amount).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
}

/** Cost per minute of outage saved per year: cents matter when it is small. */
export function usdPerMinute(amount: string | null): string {
  if (amount === null) return '—';
  const n = Number(amount);
  return `${n.toLocaleString('en-US', { style: 'currency', currency: 'USD', minimumFractionDigits: n < 1 ? 3 : 2, maximumFractionDigits: n < 1 ? 3 : 2 })}`;
}

export function degrees(value: number, places = 1): string {
  return `${fixed(value, places)}°`;
}

/** "19.5° W" for a satellite slot (east-positive longitudes). */
export function orbitalSlot(longitudeDeg: number): string {
  if (longitudeDeg === 0) return '0.0°';
  return `${fixed(Math.abs(longitudeDeg), 1)}° ${longitudeDeg < 0 ? 'W' : 'E'}`;
}

export const dateTimeFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC' });
export const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
