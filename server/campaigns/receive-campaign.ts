import 'server-only';
import { models } from '@/db/models';
import { listDishes } from '@/db/queries/dishes';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { deleteCampaign, insertCampaign, insertCampaignProblems, insertCampaignSites, markCampaignQueued, type ChunkPlan } from '@/db/queries/campaigns';
import { getEnv } from '@/server/env';
import { InvalidInputError, NotFoundError, PlanLimitError } from '@/server/errors';
import { getPlanLimits } from '@/server/billing/limits';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf } from '@/server/studies/snapshot-of';
import { EACH_SITE_CLIMATE_LABEL } from '@/server/validation/campaign';
import type { CampaignUploadQuery } from '@/server/validation/campaign-upload';
import { assertQueueReachable, enqueueChunks } from './campaign-queue';
import type { CampaignInputs } from './campaign-inputs';
import { CsvRecordSplitter, headerProblems, isBlankRecord, parseCampaignBatch, RECORDS_PER_BATCH, type CsvRecord } from './campaign-csv-stream';
import { campaignCsvLine, campaignProblemCells } from './campaign-result-csv';

/** A campaign file of a million ~60–100 character rows is about 100 MB; far more is not a site list. */
export const CAMPAIGN_UPLOAD_MAX_BYTES = 200 * 1024 * 1024;

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
 *  3. the body is decoded and split into records as it arrives and read a batch at a time
 *     (parseCampaignBatch): valid rows go to campaign_sites, problems by line to campaign_problems;
 *     a count over the plan's limit, a binary or non-UTF-8 body, or a header without the columns
 *     stops it there;
 *  4. chunks, counts and status "queued" in one transaction, then every chunk job in one addBulk.
 * Any failure deletes the campaign and whatever was staged: a campaign is either queued whole or
 * not there at all (a chunk job that slipped into Redis finds no campaign and does nothing).
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

  try {
    const read = await stageFile(id, companyId, filename, o.body, siteLimit);
    await markCampaignQueued(id, read);
    await enqueueChunks(id, read.chunks.length);
    return { id, rowsTotal: read.rowsTotal, sitesTotal: read.sitesTotal, problemsCount: read.problemsCount, chunks: read.chunks.length };
  } catch (error) {
    await deleteCampaign(id).catch((e) => console.error(`campaign ${id}: cleaning up after a failed upload failed:`, e));
    throw error;
  }
}

async function stageFile(campaignId: number, companyId: number, filename: string, body: ReadableStream<Uint8Array>, siteLimit: number) {
  const chunkSites = getEnv().CAMPAIGN_CHUNK_SITES;
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const splitter = new CsvRecordSplitter();
  const reader = body.getReader();
  let header: CsvRecord | null = null;
  let pending: CsvRecord[] = [];
  let bytes = 0;
  let rowsTotal = 0;
  let sitesTotal = 0;
  let problemsCount = 0;
  const firstProblems: string[] = [];
  const chunks: ChunkPlan[] = [];
  let open: ChunkPlan | null = null;

  const flush = async (records: CsvRecord[]) => {
    if (!header || records.length === 0) return;
    const batch = parseCampaignBatch(header.text, records);
    await insertCampaignSites(campaignId, batch.rows);
    const seqOf = new Map<number, number>();
    await insertCampaignProblems(
      campaignId,
      batch.problems.map((p) => {
        const line = p.line ?? 0;
        const seq = seqOf.get(line) ?? 0;
        seqOf.set(line, seq + 1);
        return { line, seq, message: p.message, csvLine: campaignCsvLine(campaignProblemCells(p)) };
      }),
    );
    problemsCount += batch.problems.length;
    for (const p of batch.problems) if (firstProblems.length < 5) firstProblems.push(p.message);
    for (const r of batch.rows) {
      if (!open) open = { firstLine: r.line, lastLine: r.line, siteCount: 0 };
      open.lastLine = r.line;
      open.siteCount++;
      sitesTotal++;
      if (open.siteCount >= chunkSites) {
        chunks.push(open);
        open = null;
      }
    }
  };

  const take = async (records: CsvRecord[]) => {
    for (const r of records) {
      if (!header) {
        if (isBlankRecord(r)) continue;
        if (r.broken) throw refuse(`"${filename}" does not start with a header line of columns: ${r.broken}`);
        const problems = headerProblems(r.text);
        if (problems.length) throw refuse(`"${filename}" cannot be read as a campaign: ${problems.join(' ')}`);
        header = r;
        continue;
      }
      if (isBlankRecord(r)) continue;
      rowsTotal++;
      if (rowsTotal > siteLimit) {
        const limits = await getPlanLimits(companyId);
        throw new PlanLimitError('campaignSites', `The ${limits.planName} plan allows ${siteLimit.toLocaleString('en-US')} sites in one campaign and "${filename}" has more. Nothing was queued. Split the file into several campaigns — or an admin can move to a larger plan in Settings → Billing.`);
      }
      pending.push(r);
    }
    if (pending.length >= RECORDS_PER_BATCH) {
      const batch = pending;
      pending = [];
      await flush(batch);
    }
  };

  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      bytes += value.byteLength;
      if (bytes > CAMPAIGN_UPLOAD_MAX_BYTES) throw refuse(`"${filename}" is over ${CAMPAIGN_UPLOAD_MAX_BYTES / 1024 / 1024} MB; a campaign file of a million sites is about 100 MB. Split it into several campaigns.`);
      if (value.includes(0)) throw refuse(`"${filename}" is not a text CSV file (it contains binary data). Save it from your spreadsheet as CSV.`);
      let text: string;
      try {
        text = decoder.decode(value, { stream: true });
      } catch {
        throw refuse(`"${filename}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
      }
      const records: CsvRecord[] = [];
      splitter.push(text, records);
      await take(records);
    }
    try {
      const records: CsvRecord[] = [];
      splitter.push(decoder.decode(), records);
      splitter.end(records);
      await take(records);
    } catch (e) {
      if (e instanceof TypeError) throw refuse(`"${filename}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
      throw e;
    }
    await flush(pending);
    pending = [];
  } finally {
    // Stop the upload when we refuse it (a no-op once it was read to the end).
    reader.cancel().catch(() => {});
  }

  if (bytes === 0) throw refuse(`"${filename}" is empty.`);
  if (!header) throw refuse(`"${filename}" is empty.`);
  if (rowsTotal === 0) throw refuse(`"${filename}" has a header line but no site rows.`);
  if (open) chunks.push(open);
  if (sitesTotal === 0) throw refuse(`None of the ${rowsTotal.toLocaleString('en-US')} rows of "${filename}" can be read; fix them and upload again. ${firstProblems.join(' ')}${problemsCount > firstProblems.length ? ` …and ${(problemsCount - firstProblems.length).toLocaleString('en-US')} more.` : ''}`);
  return { rowsTotal, sitesTotal, problemsCount, chunks };
}
