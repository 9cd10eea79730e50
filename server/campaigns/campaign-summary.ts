import 'server-only';
import Decimal from 'decimal.js';
import type { CampaignRow } from '@/db/queries/campaigns';
import { OUTAGE_BUCKETS_MIN, outageDistribution, recommendedDishMix, sitesMeetingNoTarget } from '@/db/queries/campaign-results';

/** Sites listed where no catalogue dish meets the target (the result file has them all). */
export const NONE_MEETS_LISTED = 50;

export interface CampaignSummary {
  /** Bar labels, minutes per year: "0–5", …, "960 or more". */
  buckets: string[];
  outageBefore: number[];
  outageAfter: number[];
  dishMix: { dishCm: number; dishName: string; sites: number; hardwareUsd: string; labourUsd: string; totalUsd: string }[];
  hardwareTotalUsd: string;
  labourTotalUsd: string;
  upgradeTotalUsd: string;
  noneMeets: { line: number; siteRef: string; currentDishCm: number; currentOutageMin: number }[];
}

/**
 * What the campaign means for the decision, from its kept rows: outage distribution now and after
 * the recommended upgrades, the dish mix with its hardware and labour (exact DECIMAL sums from
 * MariaDB, added with decimal.js), and the sites no catalogue dish brings to the target.
 */
export async function campaignSummary(c: CampaignRow): Promise<CampaignSummary> {
  const [dist, mix, none] = await Promise.all([outageDistribution(c.id), recommendedDishMix(c.id), sitesMeetingNoTarget(c.id, NONE_MEETS_LISTED)]);
  const edges = OUTAGE_BUCKETS_MIN;
  return {
    buckets: edges.map((from, i) => (i === edges.length - 1 ? `${from} or more` : `${from}–${edges[i + 1]}`)),
    outageBefore: dist.before,
    outageAfter: dist.after,
    dishMix: mix.map((m) => ({ ...m, totalUsd: new Decimal(m.hardwareUsd).plus(m.labourUsd).toFixed(2) })),
    hardwareTotalUsd: c.hardwareTotalUsd,
    labourTotalUsd: c.labourTotalUsd,
    upgradeTotalUsd: new Decimal(c.hardwareTotalUsd).plus(c.labourTotalUsd).toFixed(2),
    noneMeets: none,
  };
}
