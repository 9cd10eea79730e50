import { apiRoute } from '@/server/api/route';
import { getCampaign } from '@/db/queries/campaigns';
import { NotFoundError } from '@/server/errors';
import { campaignIdOf } from '@/server/validation/campaign-upload';
import { attachmentDisposition } from '@/server/uploads/download-name';
import { campaignResultStream } from '@/server/campaigns/campaign-download';

/**
 * GET /api/campaigns/:id/results — the result file, streamed page by page from MariaDB: every line
 * computed so far (while running) or all of them, problems in line order. 404 for another company.
 */
export const GET = apiRoute<'study.write', undefined, { id: string }>({ permission: 'study.write' }, async ({ ctx, params }) => {
  const id = campaignIdOf(params.id);
  const campaign = id === null ? null : await getCampaign(ctx.companyId, id);
  if (!campaign) throw new NotFoundError('That campaign');
  const name = `${campaign.filename.replace(/\.[^.]*$/, '')}-upgrades.csv`;
  return new Response(campaignResultStream(campaign.id), {
    status: 200,
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': attachmentDisposition(name, campaign.id),
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
