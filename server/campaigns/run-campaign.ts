import 'server-only';
import { models } from '@/db/models';
import { listDishes } from '@/db/queries/dishes';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { InvalidInputError, NotFoundError } from '@/server/errors';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf } from '@/server/studies/snapshot-of';
import { EACH_SITE_CLIMATE_LABEL, type CampaignInput } from '@/server/validation/campaign';
import { computeCampaign, type CampaignOutcome } from './campaign-compute';
import { parseCampaignCsv, readCampaignBytes } from './campaign-csv';
import { campaignResultCsv } from './campaign-result-csv';

/** Rows of the on-screen table; the CSV has them all. */
export const CAMPAIGN_TABLE_ROWS = 200;
/** Problems listed on the page; the CSV and the counts have them all. */
export const CAMPAIGN_LISTED_PROBLEMS = 200;

export interface CampaignResponse extends Omit<CampaignOutcome, 'results'> {
  filename: string;
  /** The first CAMPAIGN_TABLE_ROWS results and CAMPAIGN_LISTED_PROBLEMS problems, for the page. */
  results: CampaignOutcome['results'];
  csv: string;
  csvFilename: string;
  serviceName: string;
  /** How the page names the rain climate: each site's own (ITU-R maps) or the override profile. */
  climateName: string;
  /** True when a company profile overrode every site's rain climate. */
  climateOverride: boolean;
  targetAvailabilityPercent: number;
  dishCount: number;
}

/**
 * An upgrade campaign, computed on request and kept nowhere. The plan's monthly upload limit is
 * checked inside a transaction under the company row lock (lockCompanyRow); no upload row is
 * written, so a campaign is checked against the limit but not counted (the uploads table's kind
 * enum has no campaign kind).
 */
export async function runCampaign(companyId: number, input: CampaignInput): Promise<CampaignResponse> {
  const filename = input.file.name || 'campaign.csv';
  const bytes = new Uint8Array(await input.file.arrayBuffer());
  const text = readCampaignBytes(bytes, filename);
  if (!text.ok) throw new InvalidInputError(text.error, { file: [text.error] });
  const parsed = parseCampaignCsv(text.text);
  if (parsed.rows.length === 0 && parsed.problems.some((p) => p.line === null || parsed.rowCount === 0)) {
    const message = parsed.problems.slice(0, 3).map((p) => p.message).join(' ');
    throw new InvalidInputError(message, { file: parsed.problems.slice(0, 100).map((p) => p.message) });
  }

  const { sequelize } = models();
  const { service, climate, dishes } = await sequelize.transaction(async (t) => {
    const service = await getServiceProfile(companyId, input.serviceProfileId, t);
    if (!service) throw new NotFoundError('That service profile');
    // No profile: each site's own rain climate from the ITU-R maps (the default, server/engine/README.md §1).
    const climate = input.climateProfileId === null ? null : await getClimateProfile(companyId, input.climateProfileId, t);
    if (input.climateProfileId !== null && !climate) throw new NotFoundError('That climate profile');
    await assertWithinPlan(await lockCompanyRow(companyId, t), 'uploadsPerMonth');
    return { service, climate, dishes: await listDishes(companyId, { activeOnly: true }) };
  });
  if (dishes.length === 0) {
    const message = 'The dish catalogue has no active dishes: add or activate dishes on the Dishes page first.';
    throw new InvalidInputError(message, { file: [message] });
  }

  const outcome = computeCampaign({
    rows: parsed.rows,
    service: serviceSnapshotOf(service),
    climate: climate ? climateSnapshotOf(climate) : null,
    dishes: dishes.map(dishSnapshotOf),
    targetAvailabilityPercent: input.targetAvailabilityPercent,
    fileProblems: parsed.problems,
    rowCount: parsed.rowCount,
  });
  return {
    ...outcome,
    results: outcome.results.slice(0, CAMPAIGN_TABLE_ROWS),
    problems: outcome.problems.slice(0, CAMPAIGN_LISTED_PROBLEMS),
    filename,
    csv: campaignResultCsv(outcome.results, outcome.problems),
    csvFilename: `${filename.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9._-]+/g, '-').slice(0, 80) || 'campaign'}-upgrades.csv`,
    serviceName: service.name,
    climateName: climate ? climate.name : EACH_SITE_CLIMATE_LABEL,
    climateOverride: climate !== null,
    targetAvailabilityPercent: input.targetAvailabilityPercent,
    dishCount: dishes.length,
  };
}
