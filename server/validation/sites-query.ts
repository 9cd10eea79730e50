import { z } from 'zod';
import { listQuerySchema } from './paging';

/** `?q=&page=&pageSize=&customerId=` of GET /api/v1/sites (shared by the route and its OpenAPI description). */
export const sitesQuerySchema = listQuerySchema.extend({
  customerId: z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number().int().positive().optional()),
});
