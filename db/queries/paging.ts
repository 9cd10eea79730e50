import { Op, type WhereOptions } from 'sequelize';
import type { Paged } from '@/server/validation/paging';

/** `q` as a LIKE pattern matched anywhere, with the person's % and _ taken literally. */
export function containsPattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** An OR of LIKE matches over the given columns, or nothing when there is no search text. */
export function searchWhere(q: string, columns: string[]): WhereOptions {
  if (!q) return {};
  const pattern = containsPattern(q);
  return { [Op.or]: columns.map((c) => ({ [c]: { [Op.like]: pattern } })) };
}

export function paged<T>(items: T[], total: number, page: number, pageSize: number): Paged<T> {
  return { items, page, pageSize, total, pageCount: Math.max(1, Math.ceil(total / pageSize)) };
}
