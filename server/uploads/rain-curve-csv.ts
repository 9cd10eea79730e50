import { measuredCurveDataSchema } from '@/server/validation/climate';
import { parseDecimalCell, readCsvTable, type CsvProblem } from './csv-table';
import { buildReport, type ParseReport } from './parse-report';
import { MAX_UPLOAD_ROWS } from './upload-limits';

export const RAIN_CURVE_CSV_COLUMNS = { required: ['p_percent', 'rain_rate_mm_h'], optional: [] } as const;

/** ITU-R P.618-14 §2.2.1.1 takes R0.01; the curve must reach it (the engine never extrapolates). */
const REQUIRED_P_PERCENT = 0.01;

export interface RainCurvePoint {
  pPercent: number;
  rainRateMmH: number;
}

/**
 * A measured rain-rate exceedance CSV (`p_percent, rain_rate_mm_h`) → the curve's points
 * (sorted from the largest p), checked point by point and as a curve (falling, no duplicate p,
 * covering 0.01 %), with each problem on its line.
 */
export function parseRainCurveCsv(text: string, meta: { filename: string; sizeBytes: number }): { report: ParseReport; points: RainCurvePoint[] } {
  const table = readCsvTable(text, RAIN_CURVE_CSV_COLUMNS);
  const problems: CsvProblem[] = [...table.problems];
  if (table.rows.length > 200) problems.push({ line: null, message: `The file has ${table.rows.length} points; a measured curve has at most 200.` });
  if (table.rows.length > MAX_UPLOAD_ROWS) problems.splice(0, problems.length, { line: null, message: `The file has ${table.rows.length} rows; at most ${MAX_UPLOAD_ROWS} are accepted.` });
  const points: (RainCurvePoint & { line: number })[] = [];
  for (const row of problems.length ? [] : table.rows) {
    const p = parseDecimalCell(row.values.p_percent);
    const r = parseDecimalCell(row.values.rain_rate_mm_h);
    let bad = false;
    if (p === null) {
      problems.push({ line: row.line, column: 'p_percent', message: `Line ${row.line}, p_percent: "${row.values.p_percent}" is not a number.` });
      bad = true;
    } else if (!(p > 0 && p <= 100)) {
      problems.push({ line: row.line, column: 'p_percent', message: `Line ${row.line}, p_percent: ${p} must be above 0 and at most 100 (% of the year).` });
      bad = true;
    }
    if (r === null) {
      problems.push({ line: row.line, column: 'rain_rate_mm_h', message: `Line ${row.line}, rain_rate_mm_h: "${row.values.rain_rate_mm_h}" is not a number.` });
      bad = true;
    } else if (!(r > 0 && r <= 1000)) {
      problems.push({ line: row.line, column: 'rain_rate_mm_h', message: `Line ${row.line}, rain_rate_mm_h: ${r} must be above 0 and at most 1000 mm/h.` });
      bad = true;
    }
    if (!bad) points.push({ line: row.line, pPercent: p as number, rainRateMmH: r as number });
  }
  if (problems.length === 0) {
    const curve = measuredCurveDataSchema.safeParse({ points: points.map(({ pPercent, rainRateMmH }) => ({ pPercent, rainRateMmH })) });
    if (!curve.success) {
      for (const issue of curve.error.issues) {
        const i = issue.path[1];
        const line = typeof i === 'number' ? points[i].line : null;
        const column = issue.path[2] === 'pPercent' ? 'p_percent' : issue.path[2] === 'rainRateMmH' ? 'rain_rate_mm_h' : undefined;
        problems.push({ line, column, message: line ? `Line ${line}: ${issue.message}` : issue.message });
      }
    }
  }
  const sorted = [...points].sort((a, b) => b.pPercent - a.pPercent);
  if (problems.length === 0 && sorted.length) {
    const minP = sorted[sorted.length - 1].pPercent;
    const maxP = sorted[0].pPercent;
    if (minP > REQUIRED_P_PERCENT || maxP < REQUIRED_P_PERCENT) {
      problems.push({
        line: null,
        message: `The curve covers ${minP}–${maxP} % of the year but must include 0.01 %: ITU-R P.618-14 works from R0.01, and a measured curve is never extrapolated.`,
      });
    }
  }
  const ok = problems.length === 0;
  const report = buildReport({
    kind: 'rain-curve',
    filename: meta.filename,
    sizeBytes: meta.sizeBytes,
    columns: table.columns,
    ignoredColumns: table.ignoredColumns,
    rowCount: table.rows.length,
    problems,
    summary: ok
      ? `${sorted.length} points from ${sorted[sorted.length - 1].pPercent} % to ${sorted[0].pPercent} % of the year, all valid.`
      : `${problems.length} problem${problems.length > 1 ? 's' : ''} found; nothing will be saved until the curve is valid.`,
    preview: sorted.map((pt) => ({ line: pt.line, pPercent: pt.pPercent, rainRateMmH: pt.rainRateMmH })),
  });
  return { report, points: ok ? sorted.map(({ pPercent, rainRateMmH }) => ({ pPercent, rainRateMmH })) : [] };
}
