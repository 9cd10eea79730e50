import 'server-only';
import { deleteStagedRows, findGivenUpWithStagedRows, findStaleUploads, giveUpUpload } from '@/db/queries/campaign-stale-uploads';
import { getEnv } from '@/server/env';
import { durationWords } from './campaign-status-words';

export interface SweepOutcome {
  /** Campaigns this sweep marked failed. */
  givenUp: number[];
  /** Staged rows it deleted (of those, and of earlier given-up uploads a sweep did not finish). */
  rowsDeleted: number;
}

/** When a campaign still receiving counts as abandoned: no batch written for CAMPAIGN_UPLOAD_STALE_SECONDS. */
export const staleUploadCutoff = (now = new Date()) => new Date(now.getTime() - getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS * 1000);

/**
 * An upload whose web process died (or whose client vanished) mid-file leaves its campaign
 * "receiving" forever, with the rows staged so far. The campaign workers run this sweep on a
 * BullMQ job scheduler (worker-main.ts): each such campaign is marked failed with a message the
 * list and the campaign page show, then its staged rows are deleted in short transactions. Safe
 * with any number of app and worker processes: giving up is one conditional UPDATE per campaign
 * (exactly one sweep wins it, and an upload that wrote a batch meanwhile is left alone), and an
 * upload that resumes after it was given up is refused at its next batch (CampaignUploadStoppedError).
 */
export async function sweepStaleUploads(now = new Date()): Promise<SweepOutcome> {
  const cutoff = staleUploadCutoff(now);
  const quiet = durationWords(getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS);
  const givenUp: number[] = [];
  for (const id of await findStaleUploads(cutoff)) {
    const message = `The file stopped arriving: nothing more was received for ${quiet} (the upload was interrupted — the connection or the server was lost). Nothing was computed; upload the file again.`;
    if (await giveUpUpload(id, cutoff, message, now)) givenUp.push(id);
  }
  let rowsDeleted = 0;
  for (const id of await findGivenUpWithStagedRows()) rowsDeleted += await deleteStagedRows(id);
  return { givenUp, rowsDeleted };
}
