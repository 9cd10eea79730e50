import { apiRoute } from '@/server/api/route';
import { studyListQuerySchema } from '@/server/validation/study';
import { listStudies } from '@/db/queries/studies';

/** GET /api/v1/studies?q=&page=&pageSize=&archived=hide|include|only — this company's studies, newest first (summary rows); archived ones hidden by default. */
export const GET = apiRoute({ permission: 'study.read', schema: studyListQuerySchema }, async ({ ctx, input }) => listStudies(ctx.companyId, input));
