import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import { CampaignUploadStoppedError } from './campaign-staging';

export type CampaignStatus = 'receiving' | 'queued' | 'running' | 'done' | 'cancelled' | 'failed';

export interface CampaignRow {
  id: number;
  companyId: number;
  status: CampaignStatus;
  filename: string;
  serviceName: string;
  climateName: string;
  climateOverride: boolean;
  targetAvailabilityPercent: number;
  rowsTotal: number;
  sitesTotal: number;
  sitesDone: number;
  problemsCount: number;
  upgradeCount: number;
  alreadyMeetsCount: number;
  noneMeetsCount: number;
  hardwareTotalUsd: string;
  labourTotalUsd: string;
  chunksTotal: number;
  chunksDone: number;
  failureMessage: string | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
  updatedAt: Date;
}

type Raw = Record<string, unknown>;
const sql = () => models().sequelize;

function rowOf(r: Raw): CampaignRow {
  return {
    id: Number(r.id),
    companyId: Number(r.company_id),
    status: r.status as CampaignStatus,
    filename: String(r.filename),
    serviceName: String(r.service_name),
    climateName: String(r.climate_name),
    climateOverride: Boolean(r.climate_override),
    targetAvailabilityPercent: Number(r.target_availability_percent),
    rowsTotal: Number(r.rows_total),
    sitesTotal: Number(r.sites_total),
    sitesDone: Number(r.sites_done),
    problemsCount: Number(r.problems_count),
    upgradeCount: Number(r.upgrade_count),
    alreadyMeetsCount: Number(r.already_meets_count),
    noneMeetsCount: Number(r.none_meets_count),
    hardwareTotalUsd: String(r.hardware_total_usd),
    labourTotalUsd: String(r.labour_total_usd),
    chunksTotal: Number(r.chunks_total),
    chunksDone: Number(r.chunks_done),
    failureMessage: (r.failure_message as string | null) ?? null,
    createdAt: r.created_at as Date,
    startedAt: (r.started_at as Date | null) ?? null,
    finishedAt: (r.finished_at as Date | null) ?? null,
    updatedAt: r.updated_at as Date,
  };
}

const COLUMNS = `id, company_id, status, filename, service_name, climate_name, climate_override, target_availability_percent, rows_total, sites_total,
  sites_done, problems_count, upgrade_count, already_meets_count, none_meets_count, hardware_total_usd, labour_total_usd, chunks_total, chunks_done,
  failure_message, created_at, started_at, finished_at, updated_at`;

/** A new campaign in status "receiving" (its file is still streaming in). */
export async function insertCampaign(
  o: { companyId: number; userId: string | null; filename: string; serviceName: string; climateName: string; climateOverride: boolean; targetAvailabilityPercent: number; inputs: unknown },
  t: Transaction,
): Promise<number> {
  const now = new Date();
  const [id] = await sql().query(
    `INSERT INTO campaigns (company_id, created_by_user_id, status, filename, service_name, climate_name, climate_override, target_availability_percent, inputs, created_at, updated_at)
     VALUES (:companyId, :userId, 'receiving', :filename, :serviceName, :climateName, :climateOverride, :target, :inputs, :now, :now)`,
    {
      replacements: { ...o, target: o.targetAvailabilityPercent, inputs: JSON.stringify(o.inputs), now },
      type: QueryTypes.INSERT,
      transaction: t,
    },
  );
  return Number(id);
}

/** One company's campaign, or null (another company's id reads as missing). */
export async function getCampaign(companyId: number, id: number): Promise<CampaignRow | null> {
  const rows = await sql().query<Raw>(`SELECT ${COLUMNS} FROM campaigns WHERE id = :id AND company_id = :companyId`, { replacements: { id, companyId }, type: QueryTypes.SELECT });
  return rows[0] ? rowOf(rows[0]) : null;
}

/** The inputs a campaign was computed with (service, climate override, dishes, target), kept as a snapshot. */
export async function getCampaignInputs(campaignId: number, t?: Transaction): Promise<{ status: CampaignStatus; inputs: unknown } | null> {
  const rows = await sql().query<Raw>('SELECT status, inputs FROM campaigns WHERE id = :campaignId', { replacements: { campaignId }, type: QueryTypes.SELECT, transaction: t });
  if (!rows[0]) return null;
  const inputs = rows[0].inputs;
  return { status: rows[0].status as CampaignStatus, inputs: typeof inputs === 'string' ? JSON.parse(inputs) : inputs };
}

export async function listCampaigns(companyId: number, limit = 100): Promise<CampaignRow[]> {
  const rows = await sql().query<Raw>(`SELECT ${COLUMNS} FROM campaigns WHERE company_id = :companyId ORDER BY created_at DESC, id DESC LIMIT :limit`, {
    replacements: { companyId, limit },
    type: QueryTypes.SELECT,
  });
  return rows.map(rowOf);
}

/** Removes a campaign and everything staged for it (a failed upload leaves nothing behind). */
export async function deleteCampaign(id: number): Promise<void> {
  await sql().transaction(async (t) => {
    for (const table of ['campaign_problems', 'campaign_results', 'campaign_chunks', 'campaign_sites']) {
      await sql().query(`DELETE FROM ${table} WHERE campaign_id = :id`, { replacements: { id }, transaction: t });
    }
    await sql().query('DELETE FROM campaigns WHERE id = :id', { replacements: { id }, transaction: t });
  });
}

export interface StagedSite {
  line: number;
  siteRef: string;
  latDeg: number;
  lonDeg: number;
  altitudeM: number | null;
  currentDishCm: number;
}

/** Many rows in one INSERT: a multi-row VALUES list with positional placeholders. */
async function insertMany(head: string, width: number, values: unknown[][], t?: Transaction, ignore = false): Promise<void> {
  if (values.length === 0) return;
  const group = `(${new Array(width).fill('?').join(',')})`;
  await sql().query(`INSERT ${ignore ? 'IGNORE ' : ''}INTO ${head} VALUES ${values.map(() => group).join(',')}`, { replacements: values.flat(), transaction: t });
}

export interface StoredProblem {
  line: number;
  seq: number;
  message: string;
  csvLine: string;
}

/** INSERT IGNORE: a problem already written for (campaign, line, seq) stays as it was. */
export async function insertCampaignProblems(campaignId: number, problems: StoredProblem[], t?: Transaction): Promise<void> {
  await insertMany('campaign_problems (campaign_id, line_no, seq, message, csv_line)', 5, problems.map((p) => [campaignId, p.line, p.seq, p.message, p.csvLine]), t, true);
}

export interface ChunkPlan {
  firstLine: number;
  lastLine: number;
  siteCount: number;
}

/** The file is in: its chunks, counts and status "queued", in one transaction (only from "receiving"). */
export async function markCampaignQueued(campaignId: number, o: { rowsTotal: number; sitesTotal: number; problemsCount: number; chunks: ChunkPlan[] }): Promise<void> {
  await sql().transaction(async (t) => {
    for (let i = 0; i < o.chunks.length; i += 1000) {
      await insertMany(
        'campaign_chunks (campaign_id, chunk_no, first_line, last_line, site_count, done_at)',
        6,
        o.chunks.slice(i, i + 1000).map((c, k) => [campaignId, i + k, c.firstLine, c.lastLine, c.siteCount, null]),
        t,
      );
    }
    const [, queued] = await sql().query(
      `UPDATE campaigns SET status = 'queued', rows_total = :rowsTotal, sites_total = :sitesTotal, problems_count = :problemsCount, chunks_total = :chunks, updated_at = :now
       WHERE id = :campaignId AND status = 'receiving'`,
      { replacements: { campaignId, rowsTotal: o.rowsTotal, sitesTotal: o.sitesTotal, problemsCount: o.problemsCount, chunks: o.chunks.length, now: new Date() }, type: QueryTypes.UPDATE, transaction: t },
    );
    // Given up by the stale-upload sweep meanwhile: the chunks above roll back with this.
    if (Number(queued) === 0) throw new CampaignUploadStoppedError();
  });
}

/** Cancels a queued or running campaign of this company; false when there is none to cancel. */
export async function cancelCampaignRow(companyId: number, id: number): Promise<boolean> {
  const [, affected] = await sql().query(
    `UPDATE campaigns SET status = 'cancelled', finished_at = :now, updated_at = :now WHERE id = :id AND company_id = :companyId AND status IN ('queued', 'running')`,
    { replacements: { id, companyId, now: new Date() }, type: QueryTypes.UPDATE },
  );
  return Number(affected) > 0;
}

export async function markCampaignFailed(campaignId: number, message: string): Promise<void> {
  await sql().query(`UPDATE campaigns SET status = 'failed', failure_message = :message, finished_at = :now, updated_at = :now WHERE id = :campaignId AND status IN ('queued', 'running')`, {
    replacements: { campaignId, message, now: new Date() },
  });
}
