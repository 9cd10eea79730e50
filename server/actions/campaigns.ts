'use server';

import { safeAction } from './safe-action';
import { cancelCampaign } from '@/server/campaigns/cancel-campaign';
import { cancelCampaignSchema } from '@/server/validation/campaign-upload';

/**
 * Upgrade campaigns are uploaded through POST /api/campaign-uploads (a streamed route handler:
 * files up to a million sites do not fit a server action) and computed by background workers.
 * The one action here cancels a queued or running campaign of the company (another company's
 * id: 404). Admins and installers (study.write).
 */
export const cancelUpgradeCampaign = safeAction({ schema: cancelCampaignSchema, permission: 'study.write' }, async (input, ctx) => {
  await cancelCampaign(ctx.companyId, input.campaignId);
  return { message: 'Campaign cancelled: no further sites will be computed. Sites already computed stay in the result file.' };
});
