import 'server-only';
import { QueryTypes } from 'sequelize';
import { models } from '../models';

/**
 * Uploads that stopped half-way (server/campaigns/stale-uploads.ts). No locking reads: a campaign
 * is given up by one conditional UPDATE, so any number of sweeps may run at once and exactly one
 * of them wins each campaign; an upload writing a batch holds the row and keeps it fresh.
 */

const sql = () => models().sequelize;

/** Campaigns still "receiving" whose last batch was written before `cutoff`. */
export async function findStaleUploads(cutoff: Date, limit = 50): Promise<number[]> {
  const rows = await sql().query<{ id: number }>(`SELECT id FROM campaigns WHERE status = 'receiving' AND updated_at < :cutoff ORDER BY id LIMIT :limit`, {
    replacements: { cutoff, limit },
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => Number(r.id));
}

/**
 * Marks the campaign failed with `message` if it is still receiving and still without progress
 * since `cutoff`; true when this call did it (another sweep, or a batch written meanwhile, makes it false).
 */
export async function giveUpUpload(campaignId: number, cutoff: Date, message: string, now = new Date()): Promise<boolean> {
  const [, changed] = await sql().query(
    `UPDATE campaigns SET status = 'failed', failure_message = :message, finished_at = :now, updated_at = :now
     WHERE id = :campaignId AND status = 'receiving' AND updated_at < :cutoff`,
    { replacements: { campaignId, cutoff, message, now }, type: QueryTypes.UPDATE },
  );
  return Number(changed) === 1;
}

/**
 * Given-up uploads that still have staged rows: failed before any chunk was planned (a campaign
 * that reached the queue has chunks), so only an interrupted upload looks like this. A sweep that
 * died while deleting leaves its campaign here for the next one.
 */
export async function findGivenUpWithStagedRows(limit = 50): Promise<number[]> {
  const rows = await sql().query<{ id: number }>(
    `SELECT c.id FROM campaigns c
     WHERE c.status = 'failed' AND c.chunks_total = 0
       AND (EXISTS (SELECT 1 FROM campaign_sites s WHERE s.campaign_id = c.id) OR EXISTS (SELECT 1 FROM campaign_problems p WHERE p.campaign_id = c.id))
     ORDER BY c.id LIMIT :limit`,
    { replacements: { limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => Number(r.id));
}

/**
 * Deletes a given-up campaign's staged sites and problems, `rowsPerTransaction` at a time: each
 * DELETE is its own short transaction, so a million staged rows never hold one huge undo log or
 * block the tables. Returns the rows deleted.
 */
export async function deleteStagedRows(campaignId: number, rowsPerTransaction = 10_000): Promise<number> {
  let total = 0;
  for (const table of ['campaign_sites', 'campaign_problems']) {
    for (;;) {
      const deleted = await sql().transaction(async (t) => {
        const affected: unknown = await sql().query(`DELETE FROM ${table} WHERE campaign_id = :campaignId LIMIT :n`, {
          replacements: { campaignId, n: rowsPerTransaction },
          type: QueryTypes.BULKDELETE,
          transaction: t,
        });
        return Number(affected);
      });
      total += deleted;
      if (deleted < rowsPerTransaction) break;
    }
  }
  return total;
}
