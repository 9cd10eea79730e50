import { z } from 'zod';
import { apiRoute } from '@/server/api/route';
import { listQuerySchema } from '@/server/validation/paging';
import { listSites } from '@/db/queries/sites';

const sitesQuerySchema = listQuerySchema.extend({
  customerId: z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number().int().positive().optional()),
});

/** GET /api/v1/sites?q=&page=&pageSize=&customerId= — this company's sites with their customer. */
export const GET = apiRoute({ permission: 'customer.read', schema: sitesQuerySchema }, async ({ ctx, input }) => listSites(ctx.companyId, input));
