import 'server-only';
import { models } from '@/db/models';
import { listDishes } from '@/db/queries/dishes';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { deleteCampaign, insertCampaign, markCampaignQueued } from '@/db/queries/campaigns';
import { InvalidInputError, NotFoundError, PlanLimitError } from '@/server/errors';
import { getPlanLimits } from '@/server/billing/limits';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf } from '@/server/studies/snapshot-of';
import { EACH_SITE_CLIMATE_LABEL } from '@/server/validation/campaign';
import type { CampaignUploadQuery } from '@/server/validation/campaign-upload';
import { assertQueueReachable, enqueueChunks } from './campaign-queue';
import type { CampaignInputs } from './campaign-inputs';
import { stageCampaignFile } from './stage-campaign-file';

export interface ReceivedCampaign {
  id: number;
  rowsTotal: number;
  sitesTotal: number;
  problemsCount: number;
  chunks: number;
}

const refuse = (message: string) => new InvalidInputError(message, { file: [message] });

/**
 * A campaign file streamed from the request body into MariaDB, then queued as chunk jobs:
 *  1. Redis must answer first (QueueUnavailableError, 503), so nobody uploads 100 MB to be refused;
 *  2. the service, climate override and active dishes are copied into the campaign's inputs and
 *     the row is created ("receiving") under the company lock, the plan's per-campaign site limit read;
 *  3. stageCampaignFile reads the body as it arrives, a batch at a time, each batch written in
 *     its own transaction before more is read: valid rows go to campaign_sites, problems by line
 *     to campaign_problems; a count over the plan's limit, a binary or non-UTF-8 body, or a header
 *     without the columns stops it there;
 *  4. chunks, counts and status "queued" in one transaction, then every chunk job in one addBulk.
 * Any failure deletes the campaign and whatever was staged: a campaign is either queued whole or
 * not there at all (a chunk job that slipped into Redis finds no campaign and does nothing). When
 * the process dies mid-upload nothing here runs: the stale-upload sweep (stale-uploads.ts) gives
 * the campaign up once it has made no progress for CAMPAIGN_UPLOAD_STALE_SECONDS.
 */
export async function receiveCampaign(o: { companyId: number; userId: string | null; query: CampaignUploadQuery; body: ReadableStream<Uint8Array> | null }): Promise<ReceivedCampaign> {
  const { companyId, query } = o;
  await assertQueueReachable();
  const filename = query.filename.split(/[\\/]/).pop()!.slice(0, 255) || 'campaign.csv';

  const { sequelize } = models();
  const [dishes, service, climate] = await Promise.all([
    listDishes(companyId, { activeOnly: true }),
    getServiceProfile(companyId, query.serviceProfileId),
    query.climateProfileId === null ? Promise.resolve(null) : getClimateProfile(companyId, query.climateProfileId),
  ]);
  if (!service) throw new NotFoundError('That service profile');
  if (query.climateProfileId !== null && !climate) throw new NotFoundError('That climate profile');
  if (dishes.length === 0) throw refuse('The dish catalogue has no active dishes: add or activate dishes on the Dishes page first.');
  if (!o.body) throw refuse('The request has no file: send the CSV as the request body.');

  const inputs: CampaignInputs = {
    schemaVersion: 1,
    service: serviceSnapshotOf(service),
    climate: climate ? climateSnapshotOf(climate) : null,
    dishes: dishes.map(dishSnapshotOf),
    targetAvailabilityPercent: query.targetAvailabilityPercent,
  };
  const { id, siteLimit } = await sequelize.transaction(async (t) => {
    // The site cap is per campaign (checked while the file streams in); nothing monthly is counted.
    await lockCompanyRow(companyId, t);
    const siteLimit = (await getPlanLimits(companyId, t, { lockedRead: true })).campaignSites;
    const id = await insertCampaign(
      { companyId, userId: o.userId, filename, serviceName: service.name, climateName: climate ? climate.name : EACH_SITE_CLIMATE_LABEL, climateOverride: climate !== null, targetAvailabilityPercent: query.targetAvailabilityPercent, inputs },
      t,
    );
    return { id, siteLimit };
  });

  const overLimit = async (): Promise<never> => {
    const limits = await getPlanLimits(companyId);
    throw new PlanLimitError('campaignSites', `The ${limits.planName} plan allows ${siteLimit.toLocaleString('en-US')} sites in one campaign and "${filename}" has more. Nothing was queued. Split the file into several campaigns — or an admin can move to a larger plan in Settings → Billing.`);
  };
  try {
    const read = await stageCampaignFile({ campaignId: id, filename, body: o.body, siteLimit, overLimit });
    await markCampaignQueued(id, read);
    await enqueueChunks(id, read.chunks.length);
    return { id, rowsTotal: read.rowsTotal, sitesTotal: read.sitesTotal, problemsCount: read.problemsCount, chunks: read.chunks.length };
  } catch (error) {
    await deleteCampaign(id).catch((e) => console.error(`campaign ${id}: cleaning up after a failed upload failed:`, e));
    throw error;
  }
}
