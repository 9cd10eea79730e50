import { apiRoute } from '@/server/api/route';
import { sitesQuerySchema } from '@/server/validation/sites-query';
import { listSites } from '@/db/queries/sites';

/** GET /api/v1/sites?q=&page=&pageSize=&customerId= — this company's sites with their customer. */
export const GET = apiRoute({ permission: 'customer.read', schema: sitesQuerySchema }, async ({ ctx, input }) => listSites(ctx.companyId, input));
