import { apiRoute } from '@/server/api/route';
import { getStudyDashboard } from '@/db/queries/studies';

/** GET /api/v1/dashboard — counts and the latest studies of this company. */
export const GET = apiRoute({ permission: 'study.read' }, async ({ ctx }) => getStudyDashboard(ctx.companyId));
