import type { Paged } from '@/server/validation/paging';

/** `q` as a LIKE pattern matched anywhere, with the person's % and _ taken literally. */
export function containsPattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export function paged<T>(items: T[], total: number, page: number, pageSize: number): Paged<T> {
  return { items, page, pageSize, total, pageCount: Math.max(1, Math.ceil(total / pageSize)) };
}
