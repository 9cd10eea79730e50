import { readCsvTable } from '@/server/uploads/csv-table';
import { CAMPAIGN_CSV_COLUMNS, parseCampaignCsv, type CampaignProblem, type CampaignSiteRow } from './campaign-csv';

/**
 * Reading a campaign file of up to a million sites as it streams in, a batch of records at a time,
 * with the same rules and messages as a small file (parseCampaignCsv) and the line numbers of the
 * person's spreadsheet. Nothing here holds more than one batch and one record.
 */

/** A site row is ~60 characters; a "record" far longer is a quote never closed (or not a CSV at all). */
export const MAX_RECORD_CHARS = 4096;
/**
 * Records parsed and written at once (under parseCampaignCsv's CAMPAIGN_MAX_ROWS; one transaction
 * each). A batch is ~60 KB of text: 500 or 1 000 made no difference to the web process's memory
 * during a million-site upload, only more commits (slower).
 */
export const RECORDS_PER_BATCH = 2000;

export interface CsvRecord {
  /** Line of the file the record starts on (1-based, as readCsvTable counts). */
  line: number;
  text: string;
  /** Set when the record could not be delimited: the message says why; its text is not parsed. */
  broken?: string;
}

/**
 * Splits CSV text into records as it arrives: a line break inside double quotes belongs to the
 * cell. A record that runs past MAX_RECORD_CHARS is reported broken on its first line, and reading
 * resumes on the next line, so one stray quote costs one line, not the rest of the file.
 */
export class CsvRecordSplitter {
  private buf = '';
  private pos = 0;
  private start = 0;
  private inQuotes = false;
  private line = 1;
  private startLine = 1;
  private skipping = false;
  private first = true;

  push(text: string, out: CsvRecord[]): void {
    if (this.first) {
      text = text.replace(/^\uFEFF/, '');
      this.first = false;
    }
    this.buf += text;
    const b = this.buf;
    for (let i = this.pos; i < b.length; i++) {
      const ch = b.charCodeAt(i);
      if (this.skipping) {
        if (ch === 10) {
          this.skipping = false;
          this.line++;
          this.start = i + 1;
          this.startLine = this.line;
        }
        continue;
      }
      if (ch === 34) this.inQuotes = !this.inQuotes;
      else if (ch === 10) {
        if (!this.inQuotes) {
          out.push({ line: this.startLine, text: b.slice(this.start, b.charCodeAt(i - 1) === 13 ? i - 1 : i) });
          this.line++;
          this.start = i + 1;
          this.startLine = this.line;
          continue;
        }
        this.line++;
      }
      if (i - this.start > MAX_RECORD_CHARS) {
        const opened = this.inQuotes;
        out.push({ line: this.startLine, text: '', broken: opened ? 'a quoted cell is opened with " but never closed.' : `the line is longer than ${MAX_RECORD_CHARS} characters.` });
        // Resume after the record's first line.
        const nl = b.indexOf('\n', this.start);
        this.inQuotes = false;
        if (nl >= 0 && nl <= i) {
          this.line = this.startLine + 1;
          this.start = nl + 1;
          this.startLine = this.line;
          i = nl;
        } else {
          this.line = this.startLine;
          this.skipping = true;
          this.start = i + 1;
        }
      }
    }
    this.pos = this.buf.length;
    if (this.start > 0) {
      this.buf = this.buf.slice(this.start);
      this.pos -= this.start;
      this.start = 0;
    }
    if (this.skipping) {
      this.buf = '';
      this.pos = 0;
    }
  }

  /** The last record (a file need not end with a line break). */
  end(out: CsvRecord[]): void {
    if (!this.skipping && this.buf.length > 0) out.push({ line: this.startLine, text: this.buf.replace(/\r$/, '') });
    this.buf = '';
    this.pos = 0;
  }
}

export const isBlankRecord = (r: CsvRecord) => !r.broken && r.text.replace(/[,;\t"\s]/g, '') === '';

/** The header's problems (missing or doubled columns), empty when it names what a campaign needs. */
export function headerProblems(headerText: string): string[] {
  return readCsvTable(`${headerText}\n`, CAMPAIGN_CSV_COLUMNS)
    .problems.filter((p) => p.line !== null)
    .map((p) => p.message);
}

const newlines = (s: string) => {
  let n = 0;
  for (let i = 0; i < s.length; i++) if (s.charCodeAt(i) === 10) n++;
  return n;
};

function parseWithHeader(header: string, records: CsvRecord[]): { rows: CampaignSiteRow[]; problems: CampaignProblem[] } {
  // parseCampaignCsv numbers lines within this text: map them back to the file's.
  const lineOf = new Map<number, number>();
  let line = 2 + newlines(header);
  for (const r of records) {
    lineOf.set(line, r.line);
    line += 1 + newlines(r.text);
  }
  const fix = (n: number | null, fallback: number) => lineOf.get(n ?? -1) ?? fallback;
  const parsed = parseCampaignCsv([header, ...records.map((r) => r.text)].join('\n') + '\n');
  const rows = parsed.rows.map((r) => ({ ...r, line: fix(r.line, r.line) }));
  const problems = parsed.problems.map((p) => {
    const fileLine = fix(p.line, records[0].line);
    return { ...p, line: fileLine, message: p.line === null ? `Line ${fileLine}: ${p.message}` : p.message.replace(/^Line \d+/, `Line ${fileLine}`) };
  });
  return { rows, problems };
}

/**
 * One batch of records (never the header) → valid sites and line-numbered problems, exactly as
 * parseCampaignCsv reads them. A quoting error makes papaparse give up on the whole text, so then
 * each record is read on its own and only the bad one is a problem.
 */
export function parseCampaignBatch(header: string, records: CsvRecord[]): { rows: CampaignSiteRow[]; problems: CampaignProblem[] } {
  const broken: CampaignProblem[] = records.filter((r) => r.broken).map((r) => ({ line: r.line, message: `Line ${r.line}: ${r.broken}` }));
  const good = records.filter((r) => !r.broken && !isBlankRecord(r));
  if (good.length === 0) return { rows: [], problems: broken };
  const all = parseWithHeader(header, good);
  if (all.rows.length > 0 || good.length === 1) return { rows: all.rows, problems: [...broken, ...all.problems].sort((a, b) => (a.line ?? 0) - (b.line ?? 0)) };
  const rows: CampaignSiteRow[] = [];
  const problems = [...broken];
  for (const r of good) {
    const one = parseWithHeader(header, [r]);
    rows.push(...one.rows);
    problems.push(...one.problems);
  }
  return { rows, problems: problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0)) };
}
