import type { CsvProblem } from './csv-table';
import { MAX_REPORTED_PROBLEMS } from './upload-limits';

export type UploadKindName = 'dish-catalogue' | 'rain-curve' | 'climate-normals';

/**
 * What a person sees after a preview, and what is stored beside an accepted file. Kept small
 * and JSON-safe: it is rendered by the upload panel and saved in `uploads.parse_report`.
 */
export interface ParseReport {
  kind: UploadKindName;
  filename: string;
  sizeBytes: number;
  columns: string[];
  ignoredColumns: string[];
  rowCount: number;
  /** Every problem found (file-level ones have line null), at most MAX_REPORTED_PROBLEMS listed. */
  problems: CsvProblem[];
  problemCount: number;
  ok: boolean;
  /** One sentence: what the file holds, or why it cannot be used. */
  summary: string;
  /** The first rows as they will be saved (normalised), for the preview table. */
  preview: Record<string, string | number | boolean | null>[];
}

export function buildReport(base: Omit<ParseReport, 'problems' | 'problemCount' | 'ok'> & { problems: CsvProblem[] }): ParseReport {
  const problems = [...base.problems].sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
  return {
    ...base,
    problems: problems.slice(0, MAX_REPORTED_PROBLEMS),
    problemCount: problems.length,
    ok: problems.length === 0,
    preview: base.preview.slice(0, 50),
  };
}

/** A report for a file refused before any row was read (too big, not text, empty…). */
export function refusedReport(kind: UploadKindName, filename: string, sizeBytes: number, message: string): ParseReport {
  return buildReport({
    kind,
    filename,
    sizeBytes,
    columns: [],
    ignoredColumns: [],
    rowCount: 0,
    problems: [{ line: null, message }],
    summary: message,
    preview: [],
  });
}
