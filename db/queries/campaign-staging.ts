import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Connection } from 'mariadb';
import { InvalidInputError } from '@/server/errors';
import { models } from '../models';
import type { StagedSite, StoredProblem } from './campaigns';

/**
 * Writing a campaign file's rows while it streams in (server/campaigns/stage-campaign-file.ts).
 * One batch is one transaction: the campaign's "still receiving" mark, its sites and its problems.
 */

const sql = () => models().sequelize;

/** The mariadb connection a Sequelize transaction runs on (Sequelize's types do not name it). */
const connectionOf = (t: Transaction) => (t as unknown as { connection: Connection }).connection;

const SITES_INSERT = 'INSERT INTO campaign_sites (campaign_id, line_no, site_ref, lat_deg, lon_deg, altitude_m, current_dish_cm) VALUES (?, ?, ?, ?, ?, ?, ?)';
/** INSERT IGNORE: a problem already written for (campaign, line, seq) stays as it was. */
const PROBLEMS_INSERT = 'INSERT IGNORE INTO campaign_problems (campaign_id, line_no, seq, message, csv_line) VALUES (?, ?, ?, ?, ?)';

/** The upload went on after the sweep had given it up (server/campaigns/stale-uploads.ts). */
export class CampaignUploadStoppedError extends InvalidInputError {
  constructor() {
    const message = 'This upload was stopped: it made no progress for too long and was given up. Nothing was queued; upload the file again.';
    super(message, { file: [message] });
  }
}

/**
 * One batch of a streaming upload, in one transaction: the campaign row first (rows read so far
 * and updated_at, which is what the stale-upload sweep reads as progress; the row lock also keeps
 * the sweep from giving the campaign up while this batch is written), then the rows through the
 * connector's prepared bulk insert (COM_STMT_BULK_EXECUTE: values travel binary, no SQL text is
 * built per row). Throws CampaignUploadStoppedError when the campaign is no longer receiving.
 */
export async function stageCampaignBatch(campaignId: number, o: { rowsRead: number; sites: StagedSite[]; problems: StoredProblem[] }): Promise<void> {
  await sql().transaction(async (t) => {
    const [, touched] = await sql().query(`UPDATE campaigns SET rows_total = :rowsRead, updated_at = :now WHERE id = :campaignId AND status = 'receiving'`, {
      replacements: { campaignId, rowsRead: o.rowsRead, now: new Date() },
      type: QueryTypes.UPDATE,
      transaction: t,
    });
    if (Number(touched) === 0) throw new CampaignUploadStoppedError();
    const conn = connectionOf(t);
    if (o.sites.length > 0) {
      await conn.batch(
        SITES_INSERT,
        o.sites.map((s) => [campaignId, s.line, s.siteRef, s.latDeg, s.lonDeg, s.altitudeM, s.currentDishCm]),
      );
    }
    if (o.problems.length > 0) {
      await conn.batch(
        PROBLEMS_INSERT,
        o.problems.map((p) => [campaignId, p.line, p.seq, p.message, p.csvLine]),
      );
    }
  });
}
