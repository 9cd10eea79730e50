import { monthlyRainClimate } from '@/server/engine';
import { isEngineInputError } from '@/server/engine/errors';
import { parseDecimalCell, readCsvTable, type CsvProblem } from './csv-table';
import { buildReport, type ParseReport } from './parse-report';

export const CLIMATE_NORMALS_CSV_COLUMNS = { required: ['month', 'mean_total_rainfall_mm', 'mean_surface_temperature_c'], optional: [] } as const;

const MONTH_NAMES = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

/** 1–12, "Jan", "January" → month number 1–12; anything else null. */
function parseMonth(cell: string): number | null {
  const s = cell.trim().toLowerCase();
  if (/^\d{1,2}$/.test(s)) {
    const n = Number(s);
    return n >= 1 && n <= 12 ? n : null;
  }
  const i = MONTH_NAMES.findIndex((m) => m === s || (s.length >= 3 && m.startsWith(s)));
  return i >= 0 ? i + 1 : null;
}

export interface ClimateNormals {
  monthlyRainfallMm: number[];
  monthlyTemperatureC: number[];
}

/**
 * A monthly climate normals CSV (`month, mean_total_rainfall_mm, mean_surface_temperature_c`,
 * 12 rows) → the two lists of ITU-R P.837-7 Annex 1, January first, checked by running the
 * method once (the preview shows the R0.01 and P0 it gives).
 */
export function parseClimateNormalsCsv(text: string, meta: { filename: string; sizeBytes: number }): { report: ParseReport; normals: ClimateNormals | null } {
  const table = readCsvTable(text, CLIMATE_NORMALS_CSV_COLUMNS);
  const problems: CsvProblem[] = [...table.problems];
  const rain: (number | undefined)[] = new Array(12).fill(undefined);
  const temp: (number | undefined)[] = new Array(12).fill(undefined);
  const lineOfMonth: (number | undefined)[] = new Array(12).fill(undefined);
  if (table.rows.length > 12 && problems.length === 0) {
    problems.push({ line: null, message: `The file has ${table.rows.length} data rows; monthly normals have exactly 12 (one per month).` });
  }
  for (const row of problems.length ? [] : table.rows) {
    const v = row.values;
    const month = parseMonth(v.month);
    const mt = parseDecimalCell(v.mean_total_rainfall_mm);
    const t = parseDecimalCell(v.mean_surface_temperature_c);
    if (month === null) problems.push({ line: row.line, column: 'month', message: `Line ${row.line}, month: "${v.month}" must be 1–12 or a month name.` });
    if (mt === null) problems.push({ line: row.line, column: 'mean_total_rainfall_mm', message: `Line ${row.line}, mean_total_rainfall_mm: "${v.mean_total_rainfall_mm}" is not a number.` });
    else if (mt < 0 || mt > 3000) problems.push({ line: row.line, column: 'mean_total_rainfall_mm', message: `Line ${row.line}, mean_total_rainfall_mm: ${mt} must be between 0 and 3000 mm.` });
    if (t === null) problems.push({ line: row.line, column: 'mean_surface_temperature_c', message: `Line ${row.line}, mean_surface_temperature_c: "${v.mean_surface_temperature_c}" is not a number.` });
    else if (t < -70 || t > 50) problems.push({ line: row.line, column: 'mean_surface_temperature_c', message: `Line ${row.line}, mean_surface_temperature_c: ${t} must be between -70 and 50 °C.` });
    if (month === null) continue;
    const first = lineOfMonth[month - 1];
    if (first !== undefined) {
      problems.push({ line: row.line, column: 'month', message: `Line ${row.line}, month: ${MONTH_NAMES[month - 1]} is already on line ${first}.` });
      continue;
    }
    lineOfMonth[month - 1] = row.line;
    if (mt !== null) rain[month - 1] = mt;
    if (t !== null) temp[month - 1] = t;
  }
  if (problems.length === 0) {
    const missing = MONTH_NAMES.filter((_, i) => lineOfMonth[i] === undefined);
    if (missing.length) problems.push({ line: null, message: `Missing month${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}. Monthly normals need all 12 months.` });
  }
  let summary = '';
  let normals: ClimateNormals | null = null;
  if (problems.length === 0) {
    const candidate = { monthlyRainfallMm: rain as number[], monthlyTemperatureC: temp as number[] };
    try {
      const climate = monthlyRainClimate(candidate);
      if (climate.p0Percent <= 0.01) {
        problems.push({ line: null, message: 'These normals give rain less than 0.01 % of the year (P0), so there is no R0.01 for ITU-R P.618-14: check the rainfall column.' });
      } else {
        const r001 = climate.rainRateExceeded(0.01);
        normals = candidate;
        summary = `12 months, all valid. ITU-R P.837-7 Annex 1 gives P0 = ${climate.p0Percent.toFixed(2)} % of the year with rain and R0.01 = ${r001.toFixed(1)} mm/h.`;
      }
    } catch (e) {
      if (!isEngineInputError(e)) throw e;
      problems.push({ line: null, message: `The normals cannot be used: ${e.message}` });
    }
  }
  const report = buildReport({
    kind: 'climate-normals',
    filename: meta.filename,
    sizeBytes: meta.sizeBytes,
    columns: table.columns,
    ignoredColumns: table.ignoredColumns,
    rowCount: table.rows.length,
    problems,
    summary: normals ? summary : `${problems.length} problem${problems.length > 1 ? 's' : ''} found; nothing will be saved until all 12 months are valid.`,
    preview: MONTH_NAMES.map((m, i) => ({ line: lineOfMonth[i] ?? null, month: m.slice(0, 1).toUpperCase() + m.slice(1, 3), rainfallMm: rain[i] ?? null, temperatureC: temp[i] ?? null })).filter((r) => r.line !== null),
  });
  return { report, normals: report.ok ? normals : null };
}
