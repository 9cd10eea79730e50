import { z } from 'zod';
import { listQuerySchema } from '@/server/validation/paging';
import { QUOTE_LIST_STATUSES } from '@/server/validation/quote';

/** `?q=&status=&page=&pageSize=` of GET /api/v1/quotes. */
export const quoteListQuerySchema = listQuerySchema.extend({
  status: z.preprocess((v) => (v === undefined || v === '' ? 'all' : v), z.enum(QUOTE_LIST_STATUSES, { error: `status must be one of ${QUOTE_LIST_STATUSES.join(', ')}` })),
});
