import { z } from 'zod';

/** Search and paging of the list endpoints (`?q=&page=&pageSize=`). */
export const listQuerySchema = z.object({
  q: z.preprocess((v) => (typeof v === 'string' ? v.trim() : v), z.string().max(100, 'Search text must be at most 100 characters.').default('')),
  page: z.coerce.number().int().min(1, 'page starts at 1').max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'pageSize is at most 100').default(25),
});
export type ListQuery = z.infer<typeof listQuerySchema>;

/** The paged list body every list endpoint returns. */
export interface Paged<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
  pageCount: number;
}
