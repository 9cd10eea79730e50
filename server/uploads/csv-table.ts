import Papa from 'papaparse';

/** One data row of a CSV file with the line it starts on (1-based, the header is line 1). */
export interface CsvRow {
  line: number;
  values: Record<string, string>;
}

/** A problem a person can fix: the line (and column) it is on and what is wrong, in plain words. */
export interface CsvProblem {
  line: number | null;
  column?: string;
  message: string;
}

export interface CsvTable {
  columns: string[];
  rows: CsvRow[];
  /** File-level problems (no header, missing columns…); when any, `rows` is empty. */
  problems: CsvProblem[];
  /** Columns present but not used. */
  ignoredColumns: string[];
}

/** "Rain rate (mm/h)" → "rain_rate_mm_h": headers are matched loosely on letters and digits. */
export function normalizeHeader(h: string): string {
  return h
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

/**
 * Read a CSV text into rows keyed by normalised header, keeping each row's line number so that
 * every error message can point at the line in the person's spreadsheet. Comma, semicolon or tab
 * separated; blank lines are skipped (they keep their line numbers).
 *
 * @example
 * readCsvTable('a,b\n1,2\n', { required: ['a', 'b'] }).rows // => [{ line: 2, values: { a: '1', b: '2' } }]
 */
export function readCsvTable(text: string, spec: { required: readonly string[]; optional?: readonly string[] }): CsvTable {
  const empty = (problem: CsvProblem): CsvTable => ({ columns: [], rows: [], problems: [problem], ignoredColumns: [] });
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '') return empty({ line: null, message: 'The file is empty.' });

  const records: { line: number; cells: string[] }[] = [];
  const parseErrors: CsvProblem[] = [];
  let start = 0;
  let line = 1;
  Papa.parse<string[]>(body, {
    header: false,
    skipEmptyLines: false,
    delimiter: guessDelimiter(body),
    step: (result) => {
      const end = result.meta.cursor;
      // Line of this record = 1 + newlines before its first character (quoted cells may span lines).
      const cells = result.data as string[];
      for (const e of result.errors) parseErrors.push({ line, message: `Line ${line}: ${e.message}.` });
      records.push({ line, cells });
      line += countNewlines(body, start, end);
      start = end;
    },
  });
  if (parseErrors.length) return { columns: [], rows: [], problems: parseErrors, ignoredColumns: [] };

  const nonBlank = records.filter((r) => r.cells.some((c) => c.trim() !== ''));
  if (nonBlank.length === 0) return empty({ line: null, message: 'The file is empty.' });
  const [header, ...data] = nonBlank;
  const columns = header.cells.map(normalizeHeader);
  const known = new Set([...spec.required, ...(spec.optional ?? [])]);

  const problems: CsvProblem[] = [];
  const seen = new Set<string>();
  for (const c of columns) {
    if (c !== '' && seen.has(c)) problems.push({ line: header.line, column: c, message: `Column "${c}" appears twice in the header.` });
    seen.add(c);
  }
  const missing = spec.required.filter((c) => !seen.has(c));
  if (missing.length) {
    problems.push({
      line: header.line,
      message:
        `Missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}. ` +
        `The first line must name the columns: ${spec.required.join(', ')}${spec.optional?.length ? ` (optional: ${spec.optional.join(', ')})` : ''}.`,
    });
  }
  if (problems.length) return { columns, rows: [], problems, ignoredColumns: [] };
  if (data.length === 0) return { columns, rows: [], problems: [{ line: null, message: 'The file has a header line but no data rows.' }], ignoredColumns: [] };

  const rows: CsvRow[] = [];
  for (const record of data) {
    if (record.cells.length > columns.length && record.cells.slice(columns.length).some((c) => c.trim() !== '')) {
      problems.push({ line: record.line, message: `Line ${record.line} has ${record.cells.length} cells but the header has ${columns.length} columns.` });
      continue;
    }
    const values: Record<string, string> = {};
    columns.forEach((c, i) => {
      if (known.has(c)) values[c] = (record.cells[i] ?? '').trim();
    });
    rows.push({ line: record.line, values });
  }
  return { columns, rows, problems, ignoredColumns: columns.filter((c) => c !== '' && !known.has(c)) };
}

/** The separator of the header line: whichever of , ; tab appears most outside quotes (comma on a tie). */
function guessDelimiter(text: string): string {
  const firstLine = text.split(/\r?\n/).find((l) => l.trim() !== '') ?? '';
  const unquoted = firstLine.replace(/"[^"]*"/g, '');
  const counts = [',', ';', '\t'].map((d) => ({ d, n: unquoted.split(d).length - 1 }));
  const best = counts.reduce((a, b) => (b.n > a.n ? b : a));
  return best.n > 0 ? best.d : ',';
}

function countNewlines(s: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) if (s.charCodeAt(i) === 10) n++;
  return n;
}

/**
 * A decimal number as typed in a spreadsheet cell ("12.5", "+3", ".5"); anything else (words,
 * "1e3", "12,5", "") is null so the caller can say which line and column are wrong.
 */
export function parseDecimalCell(cell: string): number | null {
  const s = cell.trim();
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}
