import 'server-only';
import { QueryTypes } from 'sequelize';
import { models } from '../models';

type Raw = Record<string, unknown>;
const sql = () => models().sequelize;

/**
 * The next page of the result file after (line, seq), computed rows and problems merged in line
 * order. Keyset paging on the primary keys: each page costs the same however deep the file is.
 */
export async function campaignCsvPage(campaignId: number, after: { line: number; seq: number }, limit: number): Promise<{ line: number; seq: number; csvLine: string }[]> {
  const rows = await sql().query<Raw>(
    `(SELECT line_no, 0 AS seq, csv_line FROM campaign_results WHERE campaign_id = :campaignId AND line_no > :line ORDER BY line_no LIMIT :limit)
     UNION ALL
     (SELECT line_no, seq, csv_line FROM campaign_problems WHERE campaign_id = :campaignId AND (line_no > :line OR (line_no = :line AND seq > :seq)) ORDER BY line_no, seq LIMIT :limit)
     ORDER BY line_no, seq LIMIT :limit`,
    { replacements: { campaignId, line: after.line, seq: after.seq, limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ line: Number(r.line_no), seq: Number(r.seq), csvLine: String(r.csv_line) }));
}

/** The first problems by line (the page lists these; the file has all). */
export async function campaignProblems(campaignId: number, limit: number): Promise<{ line: number; message: string }[]> {
  const rows = await sql().query<Raw>('SELECT line_no, message FROM campaign_problems WHERE campaign_id = :campaignId ORDER BY line_no, seq LIMIT :limit', {
    replacements: { campaignId, limit },
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => ({ line: Number(r.line_no), message: String(r.message) }));
}

/** Outage buckets, minutes per year: [from, to) — the chart's bars. */
export const OUTAGE_BUCKETS_MIN = [0, 5, 15, 30, 60, 120, 240, 480, 960] as const;

function bucketCase(column: string): string {
  const parts = OUTAGE_BUCKETS_MIN.slice(1).map((to, i) => `WHEN ${column} < ${to} THEN ${i}`);
  return `CASE ${parts.join(' ')} ELSE ${OUTAGE_BUCKETS_MIN.length - 1} END`;
}

/** Sites per outage bucket now and after the recommended upgrades (sites not upgraded keep today's figure). */
export async function outageDistribution(campaignId: number): Promise<{ before: number[]; after: number[] }> {
  const count = async (column: string) => {
    const rows = await sql().query<Raw>(`SELECT ${bucketCase(column)} AS b, COUNT(*) AS n FROM campaign_results WHERE campaign_id = :campaignId GROUP BY b`, {
      replacements: { campaignId },
      type: QueryTypes.SELECT,
    });
    const out: number[] = new Array(OUTAGE_BUCKETS_MIN.length).fill(0);
    for (const r of rows) out[Number(r.b)] = Number(r.n);
    return out;
  };
  return { before: await count('current_outage_min'), after: await count('COALESCE(recommended_outage_min, current_outage_min)') };
}

/** The recommended dishes with how many sites take each and their hardware and labour (exact DECIMAL sums). */
export async function recommendedDishMix(campaignId: number): Promise<{ dishCm: number; dishName: string; sites: number; hardwareUsd: string; labourUsd: string }[]> {
  const rows = await sql().query<Raw>(
    `SELECT recommended_dish_cm, recommended_dish_name, COUNT(*) AS n, SUM(hardware_usd) AS hw, SUM(labour_usd) AS lab
       FROM campaign_results WHERE campaign_id = :campaignId AND verdict = 'upgrade'
      GROUP BY recommended_dish_cm, recommended_dish_name ORDER BY recommended_dish_cm, recommended_dish_name`,
    { replacements: { campaignId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ dishCm: Number(r.recommended_dish_cm), dishName: String(r.recommended_dish_name), sites: Number(r.n), hardwareUsd: String(r.hw), labourUsd: String(r.lab) }));
}

/** Sites where no catalogue dish meets the target, by line (the first `limit`). */
export async function sitesMeetingNoTarget(campaignId: number, limit: number): Promise<{ line: number; siteRef: string; currentDishCm: number; currentOutageMin: number }[]> {
  const rows = await sql().query<Raw>(
    `SELECT r.line_no, s.site_ref, r.current_dish_cm, r.current_outage_min FROM campaign_results r
       JOIN campaign_sites s ON s.campaign_id = r.campaign_id AND s.line_no = r.line_no
      WHERE r.campaign_id = :campaignId AND r.verdict = 'none-meets-target' ORDER BY r.line_no LIMIT :limit`,
    { replacements: { campaignId, limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ line: Number(r.line_no), siteRef: String(r.site_ref), currentDishCm: Number(r.current_dish_cm), currentOutageMin: Number(r.current_outage_min) }));
}
