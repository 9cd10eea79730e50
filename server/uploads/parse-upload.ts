import { parseClimateNormalsCsv } from './climate-normals-csv';
import { parseDishCatalogueCsv, type DishCsvRow } from './dish-catalogue-csv';
import { refusedReport, type ParseReport, type UploadKindName } from './parse-report';
import { parseRainCurveCsv, type RainCurvePoint } from './rain-curve-csv';
import { readUploadText } from './upload-limits';
import type { ClimateNormals } from './climate-normals-csv';

export type ParsedUpload =
  | { kind: 'dish-catalogue'; report: ParseReport; dishes: DishCsvRow[] }
  | { kind: 'rain-curve'; report: ParseReport; points: RainCurvePoint[] }
  | { kind: 'climate-normals'; report: ParseReport; normals: ClimateNormals | null };

/**
 * Size and encoding checks, then the kind's parser. Pure: used for the preview (nothing saved)
 * and again, from the same bytes, when the person confirms.
 */
export function parseUpload(kind: UploadKindName, bytes: Uint8Array, filename: string): ParsedUpload {
  const meta = { filename, sizeBytes: bytes.byteLength };
  const text = readUploadText(bytes, filename);
  if (!text.ok) {
    const report = refusedReport(kind, filename, bytes.byteLength, text.error);
    if (kind === 'dish-catalogue') return { kind, report, dishes: [] };
    if (kind === 'rain-curve') return { kind, report, points: [] };
    return { kind, report, normals: null };
  }
  if (kind === 'dish-catalogue') {
    const r = parseDishCatalogueCsv(text.text, meta);
    return { kind, report: r.report, dishes: r.rows };
  }
  if (kind === 'rain-curve') {
    const r = parseRainCurveCsv(text.text, meta);
    return { kind, report: r.report, points: r.points };
  }
  const r = parseClimateNormalsCsv(text.text, meta);
  return { kind, report: r.report, normals: r.normals };
}
