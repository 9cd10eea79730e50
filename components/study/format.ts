/**
 * Plain numbers, angles and dates of the study screens. Computed figures of an option
 * (availability, outage, diameter) read through server/study-option, money through
 * server/money-format.
 */
export function fixed(value: number, places: number): string {
  return value.toLocaleString('en-US', { minimumFractionDigits: places, maximumFractionDigits: places });
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
