import { apiRoute } from '@/server/api/route';
import { getEnv } from '@/server/env';
import { getCampaign } from '@/db/queries/campaigns';
import { campaignProblems } from '@/db/queries/campaign-results';
import { campaignProgress, CAMPAIGN_LISTED_PROBLEMS } from '@/server/campaigns/campaign-progress';
import { NotFoundError } from '@/server/errors';
import { campaignIdOf } from '@/server/validation/campaign-upload';

/** GET /api/campaigns/:id — a campaign's progress (the page polls it); another company's id is 404. */
export const GET = apiRoute<'study.write', undefined, { id: string }>({ permission: 'study.write' }, async ({ ctx, params }) => {
  const id = campaignIdOf(params.id);
  const campaign = id === null ? null : await getCampaign(ctx.companyId, id);
  if (!campaign) throw new NotFoundError('That campaign');
  return campaignProgress(campaign, await campaignProblems(campaign.id, CAMPAIGN_LISTED_PROBLEMS), getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS);
});
