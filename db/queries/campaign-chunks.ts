import 'server-only';
import { QueryTypes } from 'sequelize';
import { models } from '../models';
import type { StagedSite, StoredProblem } from './campaigns';
import { insertCampaignProblems } from './campaigns';

type Raw = Record<string, unknown>;
const sql = () => models().sequelize;

export interface ChunkRow {
  firstLine: number;
  lastLine: number;
  siteCount: number;
  done: boolean;
}

export async function getChunk(campaignId: number, chunkNo: number): Promise<ChunkRow | null> {
  const rows = await sql().query<Raw>('SELECT first_line, last_line, site_count, done_at FROM campaign_chunks WHERE campaign_id = :campaignId AND chunk_no = :chunkNo', {
    replacements: { campaignId, chunkNo },
    type: QueryTypes.SELECT,
  });
  const r = rows[0];
  return r ? { firstLine: Number(r.first_line), lastLine: Number(r.last_line), siteCount: Number(r.site_count), done: r.done_at !== null } : null;
}

/** The staged sites of one chunk, in line order. */
export async function readChunkSites(campaignId: number, chunk: ChunkRow): Promise<StagedSite[]> {
  const rows = await sql().query<Raw>(
    'SELECT line_no, site_ref, lat_deg, lon_deg, altitude_m, current_dish_cm FROM campaign_sites WHERE campaign_id = :campaignId AND line_no BETWEEN :first AND :last ORDER BY line_no',
    { replacements: { campaignId, first: chunk.firstLine, last: chunk.lastLine }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    line: Number(r.line_no),
    siteRef: String(r.site_ref),
    latDeg: Number(r.lat_deg),
    lonDeg: Number(r.lon_deg),
    altitudeM: r.altitude_m === null ? null : Number(r.altitude_m),
    currentDishCm: Number(r.current_dish_cm),
  }));
}

/** Marks a queued campaign running when its first chunk starts (later chunks find it running). */
export async function markCampaignRunning(campaignId: number): Promise<void> {
  const now = new Date();
  await sql().query(`UPDATE campaigns SET status = 'running', started_at = :now, updated_at = :now WHERE id = :campaignId AND status = 'queued'`, { replacements: { campaignId, now } });
}

export interface ComputedSiteRow {
  line: number;
  verdict: 'upgrade' | 'already-meets-target' | 'none-meets-target';
  currentDishCm: number;
  currentOutageMin: number;
  recommendedDishCm: number | null;
  recommendedDishName: string | null;
  recommendedOutageMin: number | null;
  hardwareUsd: string | null;
  labourUsd: string | null;
  csvLine: string;
}

export interface ChunkOutcome {
  results: ComputedSiteRow[];
  problems: StoredProblem[];
  counts: { upgrade: number; alreadyMeets: number; noneMeets: number };
  hardwareUsd: string;
  labourUsd: string;
}

export type CommitResult = 'written' | 'already-done' | 'campaign-stopped';

/**
 * Writes one computed chunk in one transaction, exactly once:
 *  1. the campaign row FOR UPDATE — chunks of one campaign commit one at a time, so the last one
 *     sees every other chunk's counts and closes the campaign; a cancelled campaign writes nothing;
 *  2. the chunk row FOR UPDATE — a chunk already done (a retried or stalled job run twice) writes nothing;
 *  3. results and problems with INSERT IGNORE on (campaign, line): even a second writer past step 2
 *     could not duplicate a line;
 *  4. the chunk done, the campaign's counters and money totals added (exact DECIMAL arithmetic).
 */
export async function commitChunk(campaignId: number, chunkNo: number, siteCount: number, out: ChunkOutcome): Promise<CommitResult> {
  return sql().transaction(async (t) => {
    const [c] = await sql().query<Raw>('SELECT status, chunks_total, chunks_done FROM campaigns WHERE id = :campaignId FOR UPDATE', { replacements: { campaignId }, type: QueryTypes.SELECT, transaction: t });
    if (!c || (c.status !== 'queued' && c.status !== 'running')) return 'campaign-stopped';
    const [chunk] = await sql().query<Raw>('SELECT done_at FROM campaign_chunks WHERE campaign_id = :campaignId AND chunk_no = :chunkNo FOR UPDATE', {
      replacements: { campaignId, chunkNo },
      type: QueryTypes.SELECT,
      transaction: t,
    });
    if (!chunk || chunk.done_at !== null) return 'already-done';
    for (let i = 0; i < out.results.length; i += 500) {
      const part = out.results.slice(i, i + 500);
      await sql().query(
        `INSERT IGNORE INTO campaign_results (campaign_id, line_no, verdict, current_dish_cm, current_outage_min, recommended_dish_cm, recommended_dish_name, recommended_outage_min, hardware_usd, labour_usd, csv_line) VALUES ${part.map(() => '(?,?,?,?,?,?,?,?,?,?,?)').join(',')}`,
        {
          replacements: part.flatMap((r) => [campaignId, r.line, r.verdict, r.currentDishCm, r.currentOutageMin, r.recommendedDishCm, r.recommendedDishName, r.recommendedOutageMin, r.hardwareUsd, r.labourUsd, r.csvLine]),
          transaction: t,
        },
      );
    }
    await insertCampaignProblems(campaignId, out.problems, t);
    const now = new Date();
    await sql().query('UPDATE campaign_chunks SET done_at = :now WHERE campaign_id = :campaignId AND chunk_no = :chunkNo', { replacements: { campaignId, chunkNo, now }, transaction: t });
    const last = Number(c.chunks_done) + 1 >= Number(c.chunks_total);
    await sql().query(
      `UPDATE campaigns SET sites_done = sites_done + :siteCount, chunks_done = chunks_done + 1, problems_count = problems_count + :problems,
         upgrade_count = upgrade_count + :upgrade, already_meets_count = already_meets_count + :already, none_meets_count = none_meets_count + :none,
         hardware_total_usd = hardware_total_usd + :hardware, labour_total_usd = labour_total_usd + :labour,
         status = ${last ? "'done'" : "'running'"}, started_at = COALESCE(started_at, :now), finished_at = ${last ? ':now' : 'NULL'}, updated_at = :now
       WHERE id = :campaignId`,
      {
        replacements: { campaignId, siteCount, problems: out.problems.length, upgrade: out.counts.upgrade, already: out.counts.alreadyMeets, none: out.counts.noneMeets, hardware: out.hardwareUsd, labour: out.labourUsd, now },
        transaction: t,
      },
    );
    return 'written';
  });
}
