import { z } from 'zod';
import { dishFields } from '@/server/validation/dish';
import { parseDecimalCell, readCsvTable, type CsvProblem } from './csv-table';
import { buildReport, type ParseReport } from './parse-report';
import { MAX_UPLOAD_ROWS } from './upload-limits';

export const DISH_CSV_COLUMNS = {
  required: ['name', 'diameter_m', 'efficiency', 'hardware_price', 'labour_price'],
  optional: ['mount_notes', 'active'],
} as const;

const FIELD_OF_COLUMN: Record<string, string> = {
  name: 'name',
  diameter_m: 'diameterM',
  efficiency: 'efficiency',
  hardware_price: 'hardwarePrice',
  labour_price: 'labourPrice',
  mount_notes: 'mountNotes',
};
const COLUMN_OF_FIELD = Object.fromEntries(Object.entries(FIELD_OF_COLUMN).map(([c, f]) => [f, c]));

const dishRowSchema = z.object(dishFields);

export interface DishCsvRow {
  line: number;
  name: string;
  diameterM: number;
  efficiency: number;
  hardwarePrice: string;
  labourPrice: string;
  mountNotes: string | null;
  active: boolean;
}

/** yes/no, true/false, 1/0; blank means active. */
function parseActive(cell: string | undefined): boolean | null {
  const s = (cell ?? '').trim().toLowerCase();
  if (s === '' || s === 'yes' || s === 'y' || s === 'true' || s === '1') return true;
  if (s === 'no' || s === 'n' || s === 'false' || s === '0') return false;
  return null;
}

/**
 * A dish catalogue CSV (`name, diameter_m, efficiency, hardware_price, labour_price[, mount_notes, active]`)
 * → the rows to upsert by name, and a report naming every bad cell by line and column.
 */
export function parseDishCatalogueCsv(text: string, meta: { filename: string; sizeBytes: number }): { report: ParseReport; rows: DishCsvRow[] } {
  const table = readCsvTable(text, DISH_CSV_COLUMNS);
  const problems: CsvProblem[] = [...table.problems];
  const rows: DishCsvRow[] = [];
  if (table.rows.length > MAX_UPLOAD_ROWS) problems.push({ line: null, message: `The file has ${table.rows.length} rows; at most ${MAX_UPLOAD_ROWS} are accepted.` });
  const names = new Map<string, number>();
  for (const row of problems.length ? [] : table.rows) {
    const v = row.values;
    // Numbers are checked as spreadsheet cells first ("12,5" or "abc" is wrong on this line), then by the shared dish schema.
    const cellProblems: CsvProblem[] = [];
    // Names are registered before any other check, so a duplicate is reported even when the first row has other faults.
    const key = v.name.trim().toLowerCase();
    const first = key ? names.get(key) : undefined;
    if (first !== undefined) cellProblems.push({ line: row.line, column: 'name', message: `Line ${row.line}, name: "${v.name.trim()}" is already on line ${first}; each dish name once.` });
    else if (key) names.set(key, row.line);
    for (const col of ['diameter_m', 'efficiency'] as const) {
      if (v[col] === '') cellProblems.push({ line: row.line, column: col, message: `Line ${row.line}, ${col}: a value is required.` });
      else if (parseDecimalCell(v[col]) === null) cellProblems.push({ line: row.line, column: col, message: `Line ${row.line}, ${col}: "${v[col]}" is not a number (use a decimal point, e.g. 0.65).` });
    }
    const active = parseActive(v.active);
    if (active === null) cellProblems.push({ line: row.line, column: 'active', message: `Line ${row.line}, active: "${v.active}" must be yes or no.` });
    if (cellProblems.length) {
      problems.push(...cellProblems);
      continue;
    }
    const parsed = dishRowSchema.safeParse({
      name: v.name,
      diameterM: v.diameter_m,
      efficiency: v.efficiency,
      hardwarePrice: v.hardware_price,
      labourPrice: v.labour_price,
      mountNotes: v.mount_notes ?? '',
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const column = COLUMN_OF_FIELD[String(issue.path[0])] ?? String(issue.path[0]);
        problems.push({ line: row.line, column, message: `Line ${row.line}, ${column}: ${issue.message}` });
      }
      continue;
    }
    rows.push({ line: row.line, ...parsed.data, active: active as boolean });
  }
  const report = buildReport({
    kind: 'dish-catalogue',
    filename: meta.filename,
    sizeBytes: meta.sizeBytes,
    columns: table.columns,
    ignoredColumns: table.ignoredColumns,
    rowCount: table.rows.length,
    problems,
    summary: problems.length
      ? `${problems.length} problem${problems.length > 1 ? 's' : ''} found; nothing will be saved until every row is valid.`
      : `${rows.length} dish${rows.length > 1 ? 'es' : ''}, all valid. Dishes with a name already in the catalogue are updated; the others are added.`,
    preview: rows.map((r) => ({ line: r.line, name: r.name, diameterM: r.diameterM, efficiency: r.efficiency, hardwarePrice: r.hardwarePrice, labourPrice: r.labourPrice, mountNotes: r.mountNotes, active: r.active })),
  });
  return { report, rows: report.ok ? rows : [] };
}
