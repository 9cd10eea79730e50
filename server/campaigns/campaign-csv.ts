import { parseCoordinate } from '@/server/validation/coordinates';
import { parseDecimalCell, readCsvTable, type CsvProblem } from '@/server/uploads/csv-table';

/** A campaign file lists existing customer sites; 5 000 rows × a catalogue stays a few seconds of engine time. */
export const CAMPAIGN_MAX_ROWS = 5000;

/** altitude_m may be left out (column or cell): the site's ITU-R P.1511-1 topographic height is used. */
export const CAMPAIGN_CSV_COLUMNS = {
  required: ['site_ref', 'latitude', 'longitude', 'current_dish_cm'],
  optional: ['altitude_m'],
} as const;

/** One existing site as read from the file (coordinates in decimal degrees, north and east positive). */
export interface CampaignSiteRow {
  line: number;
  siteRef: string;
  latDeg: number;
  lonDeg: number;
  /** Null when the file gives none: the ITU-R P.1511-1 height at the site is used. */
  altitudeM: number | null;
  currentDishCm: number;
}

/** A problem of one row (or of the whole file, line null), with the row's site reference when it has one. */
export interface CampaignProblem extends CsvProblem {
  siteRef?: string;
}

export interface CampaignCsv {
  rows: CampaignSiteRow[];
  /** Row problems (with line) and file problems (line null). File problems mean no rows at all. */
  problems: CampaignProblem[];
  /** Data rows in the file, good and bad. */
  rowCount: number;
}

/** Heights people actually install at: below the Dead Sea shore to high plateaus (P.618 accepts any ≥ −0.5 km). */
const ALTITUDE_M = { min: -500, max: 6000 };
const DISH_CM = { min: 10, max: 1500 };

function numberCell(row: { line: number; values: Record<string, string> }, column: string, range: { min: number; max: number }, unit: string, problems: CsvProblem[]): number | null {
  const cell = row.values[column] ?? '';
  if (cell === '') {
    problems.push({ line: row.line, column, message: `Line ${row.line}, ${column}: a value is required.` });
    return null;
  }
  const n = parseDecimalCell(cell);
  if (n === null) {
    problems.push({ line: row.line, column, message: `Line ${row.line}, ${column}: "${cell}" is not a number (use a decimal point, e.g. 120.5).` });
    return null;
  }
  if (n < range.min || n > range.max) {
    problems.push({ line: row.line, column, message: `Line ${row.line}, ${column}: ${n} ${unit} is outside ${range.min}–${range.max} ${unit}.` });
    return null;
  }
  return n;
}

/**
 * "Line 19, latitude: "ninety" is not a number." — parseCoordinate's message already names the axis
 * ("Latitude: …", "Latitude must be…"), so the column is not said twice; its other messages
 * ("Minutes must be below 60.") get the column in front.
 */
function coordinateProblem(line: number, column: 'latitude' | 'longitude', error: string): string {
  const axis = column === 'latitude' ? 'Latitude' : 'Longitude';
  return error.startsWith(axis) ? `Line ${line}, ${column}${error.slice(axis.length)}` : `Line ${line}, ${column}: ${error}`;
}

/**
 * A campaign CSV (`site_ref, latitude, longitude, current_dish_cm`, optional `altitude_m`) → the
 * sites to compute and a problem per bad cell, by line. A bad row is left out; the others go on.
 */
export function parseCampaignCsv(text: string): CampaignCsv {
  const table = readCsvTable(text, CAMPAIGN_CSV_COLUMNS);
  if (table.problems.length && table.rows.length === 0) return { rows: [], problems: table.problems, rowCount: 0 };
  if (table.rows.length > CAMPAIGN_MAX_ROWS) {
    return { rows: [], problems: [{ line: null, message: `The file has ${table.rows.length} rows; a campaign takes at most ${CAMPAIGN_MAX_ROWS}. Split it into several files.` }], rowCount: table.rows.length };
  }
  const problems: CampaignProblem[] = [...table.problems];
  const rows: CampaignSiteRow[] = [];
  for (const row of table.rows) {
    const own: CsvProblem[] = [];
    const siteRef = row.values.site_ref;
    if (siteRef === '') own.push({ line: row.line, column: 'site_ref', message: `Line ${row.line}, site_ref: a reference is required.` });
    else if (siteRef.length > 120) own.push({ line: row.line, column: 'site_ref', message: `Line ${row.line}, site_ref: at most 120 characters.` });
    const coords = (['latitude', 'longitude'] as const).map((column) => {
      const r = parseCoordinate(row.values[column], column === 'latitude' ? 'lat' : 'lon');
      if (!r.ok) own.push({ line: row.line, column, message: coordinateProblem(row.line, column, r.error) });
      return r.ok ? r.value : null;
    });
    // A blank altitude is "not known": the site's P.1511-1 height is used (campaign-compute.ts).
    const altitudeM = (row.values.altitude_m ?? '') === '' ? null : numberCell(row, 'altitude_m', ALTITUDE_M, 'm', own);
    const currentDishCm = numberCell(row, 'current_dish_cm', DISH_CM, 'cm', own);
    if (own.length) {
      problems.push(...own.map((p) => (siteRef ? { ...p, siteRef } : p)));
      continue;
    }
    rows.push({ line: row.line, siteRef, latDeg: coords[0]!, lonDeg: coords[1]!, altitudeM, currentDishCm: currentDishCm! });
  }
  return { rows, problems, rowCount: table.rows.length };
}
