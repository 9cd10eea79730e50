'use server';

import { safeAction } from './safe-action';
import { campaignSchema } from '@/server/validation/campaign';
import { runCampaign, type CampaignResponse } from '@/server/campaigns/run-campaign';
import { cancelCampaign } from '@/server/campaigns/cancel-campaign';
import { cancelCampaignSchema } from '@/server/validation/campaign-upload';

/**
 * Upgrade campaign: a CSV of existing customer sites → for each, the current dish's outage and
 * the smallest catalogue dish meeting the target. Admins and installers (study.write); computed
 * on request, nothing stored.
 */
export const computeUpgradeCampaign = safeAction({ schema: campaignSchema, permission: 'study.write' }, async (input, ctx) => {
  const data: CampaignResponse = await runCampaign(ctx.companyId, input);
  const c = data.counts;
  return { data, message: `${c.computed} of ${c.rows} site${c.rows === 1 ? '' : 's'} computed: ${c.upgrade} to upgrade, ${c.alreadyMeetsTarget} already meeting the target, ${c.noneMeetsTarget} with no dish meeting it, ${c.problems} problem${c.problems === 1 ? '' : 's'}.` };
});

/** Cancel a queued or running campaign of the company (another company's id: 404). Admins and installers. */
export const cancelUpgradeCampaign = safeAction({ schema: cancelCampaignSchema, permission: 'study.write' }, async (input, ctx) => {
  await cancelCampaign(ctx.companyId, input.campaignId);
  return { message: 'Campaign cancelled: no further sites will be computed. Sites already computed stay in the result file.' };
});
