import { apiRoute } from '@/server/api/route';
import { listQuerySchema } from '@/server/validation/paging';
import { listCustomers } from '@/db/queries/customers';

/** GET /api/v1/customers?q=&page=&pageSize= — this company's customers with their site counts. */
export const GET = apiRoute({ permission: 'customer.read', schema: listQuerySchema }, async ({ ctx, input }) => listCustomers(ctx.companyId, input));
