import 'server-only';
import { campaignCsvPage } from '@/db/queries/campaign-results';
import { campaignResultHeaderLine } from './campaign-result-csv';

const PAGE_ROWS = 5000;

/**
 * The result file as a stream: the header, then pages of kept CSV lines in line order, each page
 * read only when the client has taken the previous one (backpressure), so a million-line file
 * never sits in memory.
 */
export function campaignResultStream(campaignId: number): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  let after = { line: 0, seq: -1 };
  let started = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!started) {
        started = true;
        controller.enqueue(encoder.encode(campaignResultHeaderLine()));
        return;
      }
      try {
        const page = await campaignCsvPage(campaignId, after, PAGE_ROWS);
        if (page.length === 0) {
          controller.close();
          return;
        }
        controller.enqueue(encoder.encode(page.map((r) => `${r.csvLine}\r\n`).join('')));
        const last = page[page.length - 1];
        after = { line: last.line, seq: last.seq };
        if (page.length < PAGE_ROWS) controller.close();
      } catch (error) {
        controller.error(error);
      }
    },
  });
}
