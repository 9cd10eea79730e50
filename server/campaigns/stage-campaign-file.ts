import 'server-only';
import { stageCampaignBatch } from '@/db/queries/campaign-staging';
import type { ChunkPlan, StoredProblem } from '@/db/queries/campaigns';
import { getEnv } from '@/server/env';
import { CsvRecordSplitter, headerProblems, isBlankRecord, parseCampaignBatch, RECORDS_PER_BATCH, type CsvRecord } from './campaign-csv-stream';
import { CampaignFileText } from './campaign-file-text';
import { campaignCsvLine, campaignProblemCells } from './campaign-result-csv';

export interface StagedFile {
  rowsTotal: number;
  sitesTotal: number;
  problemsCount: number;
  chunks: ChunkPlan[];
}

/**
 * A campaign file from the request body into campaign_sites / campaign_problems as it arrives.
 * Memory stays flat whatever the file's size: the next piece of the body is read only once the
 * records before it are written (the body is pulled, so the client waits while MariaDB writes),
 * and at most one piece plus one batch of records is held — each batch is parsed, written in its
 * own transaction and dropped before more is read. What is kept for the whole file is counts,
 * the chunk plan (one entry per CAMPAIGN_CHUNK_SITES sites) and the first few problem messages.
 * `overLimit` is called with the row count when it passes the plan's limit and must throw.
 */
export async function stageCampaignFile(o: {
  campaignId: number;
  filename: string;
  body: ReadableStream<Uint8Array>;
  siteLimit: number;
  overLimit: () => Promise<never>;
}): Promise<StagedFile> {
  const { campaignId, filename } = o;
  const chunkSites = getEnv().CAMPAIGN_CHUNK_SITES;
  const file = new CampaignFileText(filename);
  const splitter = new CsvRecordSplitter();
  const reader = o.body.getReader();
  let header: string | null = null;
  let pending: CsvRecord[] = [];
  let rowsTotal = 0;
  let sitesTotal = 0;
  let problemsCount = 0;
  const firstProblems: string[] = [];
  const chunks: ChunkPlan[] = [];
  let open: ChunkPlan | null = null;

  const write = async (records: CsvRecord[]) => {
    if (header === null || records.length === 0) return;
    const batch = parseCampaignBatch(header, records);
    const seqOf = new Map<number, number>();
    const problems: StoredProblem[] = batch.problems.map((p) => {
      const line = p.line ?? 0;
      const seq = seqOf.get(line) ?? 0;
      seqOf.set(line, seq + 1);
      return { line, seq, message: p.message, csvLine: campaignCsvLine(campaignProblemCells(p)) };
    });
    await stageCampaignBatch(campaignId, { rowsRead: rowsTotal, sites: batch.rows, problems });
    problemsCount += problems.length;
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

  const take = async (records: CsvRecord[], last: boolean) => {
    for (const r of records) {
      if (header === null) {
        if (isBlankRecord(r)) continue;
        if (r.broken) throw file.refuse(`"${filename}" does not start with a header line of columns: ${r.broken}`);
        const problems = headerProblems(r.text);
        if (problems.length) throw file.refuse(`"${filename}" cannot be read as a campaign: ${problems.join(' ')}`);
        header = r.text;
        continue;
      }
      if (isBlankRecord(r)) continue;
      rowsTotal++;
      if (rowsTotal > o.siteLimit) await o.overLimit();
      pending.push(r);
    }
    // Whole batches only (a piece of the body can hold more than one), the rest on the last call.
    while (pending.length >= RECORDS_PER_BATCH || (last && pending.length > 0)) {
      const batch = pending.length > RECORDS_PER_BATCH ? pending.slice(0, RECORDS_PER_BATCH) : pending;
      pending = batch === pending ? [] : pending.slice(RECORDS_PER_BATCH);
      await write(batch);
    }
  };

  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      const records: CsvRecord[] = [];
      splitter.push(file.decode(value), records);
      await take(records, false);
    }
    const records: CsvRecord[] = [];
    splitter.push(file.end(), records);
    splitter.end(records);
    await take(records, true);
  } finally {
    // Stop the upload when we refuse it (a no-op once it was read to the end).
    reader.cancel().catch(() => {});
  }

  if (header === null) throw file.refuse(`"${filename}" is empty.`);
  if (rowsTotal === 0) throw file.refuse(`"${filename}" has a header line but no site rows.`);
  if (open) chunks.push(open);
  if (sitesTotal === 0) {
    const more = problemsCount > firstProblems.length ? ` …and ${(problemsCount - firstProblems.length).toLocaleString('en-US')} more.` : '';
    throw file.refuse(`None of the ${rowsTotal.toLocaleString('en-US')} rows of "${filename}" can be read; fix them and upload again. ${firstProblems.join(' ')}${more}`);
  }
  return { rowsTotal, sitesTotal, problemsCount, chunks };
}
