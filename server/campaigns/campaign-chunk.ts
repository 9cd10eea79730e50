import Decimal from 'decimal.js';
import { getCampaignInputs } from '@/db/queries/campaigns';
import { commitChunk, getChunk, markCampaignRunning, readChunkSites, type ChunkOutcome, type CommitResult } from '@/db/queries/campaign-chunks';
import { computeCampaign } from './campaign-compute';
import type { CampaignInputs } from './campaign-inputs';
import { campaignCsvLine, campaignProblemCells, campaignResultCells } from './campaign-result-csv';

export type ChunkRun = CommitResult | 'skipped';

/**
 * One chunk job: the chunk's staged sites through computeCampaign with the campaign's kept inputs
 * (each site with its own climate from the ITU-R maps), then written once by commitChunk. Safe to
 * run any number of times: a chunk already written, or a campaign cancelled, failed or deleted,
 * writes nothing. The compute happens outside any transaction; only the writes hold locks.
 */
export async function runCampaignChunk(campaignId: number, chunkNo: number): Promise<ChunkRun> {
  const campaign = await getCampaignInputs(campaignId);
  if (!campaign || (campaign.status !== 'queued' && campaign.status !== 'running')) return 'skipped';
  const chunk = await getChunk(campaignId, chunkNo);
  if (!chunk || chunk.done) return 'skipped';
  await markCampaignRunning(campaignId);

  const inputs = campaign.inputs as CampaignInputs;
  const sites = await readChunkSites(campaignId, chunk);
  const outcome = computeCampaign({ rows: sites, service: inputs.service, climate: inputs.climate, dishes: inputs.dishes, targetAvailabilityPercent: inputs.targetAvailabilityPercent });

  let hardware = new Decimal(0);
  let labour = new Decimal(0);
  const out: ChunkOutcome = {
    results: outcome.results.map((r) => {
      if (r.upgradeHardwareUsd !== null) hardware = hardware.plus(r.upgradeHardwareUsd);
      if (r.upgradeLabourUsd !== null) labour = labour.plus(r.upgradeLabourUsd);
      return {
        line: r.line,
        verdict: r.verdict,
        currentDishCm: r.currentDishCm,
        currentOutageMin: r.currentOutageMinutesPerYear,
        recommendedDishCm: r.recommendedDishCm,
        recommendedDishName: r.recommendedDishName,
        recommendedOutageMin: r.recommendedOutageMinutesPerYear,
        hardwareUsd: r.upgradeHardwareUsd,
        labourUsd: r.upgradeLabourUsd,
        csvLine: campaignCsvLine(campaignResultCells(r)),
      };
    }),
    // Engine problems: one per line, and a computed line has no file problem (those rows were never staged).
    problems: outcome.problems.map((p) => ({ line: p.line ?? 0, seq: 0, message: p.message, csvLine: campaignCsvLine(campaignProblemCells(p)) })),
    counts: { upgrade: outcome.counts.upgrade, alreadyMeets: outcome.counts.alreadyMeetsTarget, noneMeets: outcome.counts.noneMeetsTarget },
    hardwareUsd: hardware.toFixed(2),
    labourUsd: labour.toFixed(2),
  };
  return commitChunk(campaignId, chunkNo, chunk.siteCount, out);
}
