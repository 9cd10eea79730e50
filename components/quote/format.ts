export const dayFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
export const dayTimeFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC' });

/** "1 Dec 2026" from an ISO timestamp or a YYYY-MM-DD day. */
export function day(value: string): string {
  return dayFmt.format(new Date(value.length === 10 ? `${value}T00:00:00Z` : value));
}

export function dayTime(value: string): string {
  return `${dayTimeFmt.format(new Date(value))} UTC`;
}
