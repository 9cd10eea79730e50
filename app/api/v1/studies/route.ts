import { apiRoute } from '@/server/api/route';
import { listQuerySchema } from '@/server/validation/paging';
import { listStudies } from '@/db/queries/studies';

/** GET /api/v1/studies?q=&page=&pageSize= — this company's studies, newest first (summary rows). */
export const GET = apiRoute({ permission: 'study.read', schema: listQuerySchema }, async ({ ctx, input }) => listStudies(ctx.companyId, input));
