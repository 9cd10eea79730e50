import { apiRoute } from '@/server/api/route';
import { getStudy } from '@/db/queries/studies';
import { NotFoundError } from '@/server/errors';

/** GET /api/v1/studies/:id — one study with its input and result snapshots; 404 for other companies' ids. */
export const GET = apiRoute<'study.read', undefined, { id: string }>({ permission: 'study.read' }, async ({ ctx, params }) => {
  const id = /^\d{1,10}$/.test(params.id) ? Number(params.id) : NaN;
  const study = Number.isSafeInteger(id) ? await getStudy(ctx.companyId, id) : null;
  if (!study) throw new NotFoundError('That study');
  return study;
});
