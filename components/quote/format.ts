import { dateFmt, dateTimeFmt } from '@/components/study/format';

/** "1 Dec 2026" from an ISO timestamp or a YYYY-MM-DD day. */
export function day(value: string): string {
  return dateFmt.format(new Date(value.length === 10 ? `${value}T00:00:00Z` : value));
}

export function dayTime(value: string): string {
  return `${dateTimeFmt.format(new Date(value))} UTC`;
}
