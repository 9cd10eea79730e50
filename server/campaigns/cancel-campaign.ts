import 'server-only';
import { cancelCampaignRow, getCampaign } from '@/db/queries/campaigns';
import { ConflictError, NotFoundError } from '@/server/errors';
import { dropWaitingChunks } from './campaign-queue';

/**
 * Cancels a queued or running campaign: the status changes first (every worker checks it before
 * computing a chunk and again, under the campaign lock, before writing one), then the chunk jobs
 * nobody has taken yet are removed from the queue. Rows already written stay and can be downloaded.
 */
export async function cancelCampaign(companyId: number, id: number): Promise<void> {
  const campaign = await getCampaign(companyId, id);
  if (!campaign) throw new NotFoundError('That campaign');
  if (!(await cancelCampaignRow(companyId, id))) throw new ConflictError(`This campaign is already ${campaign.status}; there is nothing to cancel.`);
  await dropWaitingChunks(id, campaign.chunksTotal);
}
