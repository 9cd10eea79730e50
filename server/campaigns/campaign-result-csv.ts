import Papa from 'papaparse';
import type { CampaignResultRow, CampaignVerdict } from './campaign-compute';
import type { CampaignProblem } from './campaign-csv';
import { readCampaignRow } from './campaign-row-reading';

const VERDICT_WORDS: Record<CampaignVerdict, string> = {
  upgrade: 'upgrade',
  'already-meets-target': 'already meets the target',
  'none-meets-target': 'no dish in the catalogue meets the target',
};
export const verdictWords = (v: CampaignVerdict) => VERDICT_WORDS[v];

/** Header names carry their units, so the file reads on its own in a spreadsheet. */
export const CAMPAIGN_RESULT_HEADER = [
  'line',
  'site_ref',
  'current_dish',
  'current_dish_cm',
  'current_outage_min_per_year',
  'current_outage_bound',
  'current_availability_percent',
  'recommendation',
  'recommended_dish',
  'recommended_dish_cm',
  'recommended_outage_min_per_year',
  'recommended_outage_bound',
  'minutes_saved_per_year',
  'upgrade_price_usd',
  // Each site's own climate, each figure beside its source.
  'r001_mm_h',
  'rain_climate_source',
  'rain_height_km',
  'rain_height_source',
  'altitude_m_used',
  'altitude_source',
  // What makes up the current dish's downlink fade threshold at its outage (P.618-14 §2.5).
  'attenuation_model',
  'current_outage_gas_db',
  'current_outage_cloud_db',
  'current_outage_rain_db',
  'current_outage_scintillation_db',
  'current_outage_total_db',
] as const;

const MODEL_WORDS = { total: 'total: gases, clouds, rain, scintillation', rain: 'rain only' } as const;
const ALTITUDE_SOURCE_WORDS = { file: 'file', 'ITU-R P.1511-1': 'ITU-R P.1511-1 at the site' } as const;

const fixed = (n: number | null, digits: number) => (n === null ? '' : n.toFixed(digits));

/**
 * The campaign as CSV (papaparse unparse), one line per line of the uploaded file in its order:
 * computed sites, and rows that could not be computed with "not computed: …" in the
 * recommendation column, so nothing in the file is dropped silently. Cells that a spreadsheet
 * would run as a formula are escaped.
 */
export function campaignResultCsv(results: CampaignResultRow[], problems: CampaignProblem[] = []): string {
  const lines: { line: number; cells: string[] }[] = results.map((r) => ({ line: r.line, cells: campaignResultCells(r) }));
  for (const p of problems) lines.push({ line: p.line ?? 0, cells: campaignProblemCells(p) });
  // Stable sort: a line with several problems keeps them in the order found.
  lines.sort((a, b) => a.line - b.line);
  return Papa.unparse({ fields: [...CAMPAIGN_RESULT_HEADER], data: lines.map((l) => l.cells) }, CSV_OPTIONS);
}

const CSV_OPTIONS = { newline: '\r\n', escapeFormulae: true } as const;

/** The header line of the result file, with its line break (for files streamed row by row). */
export const campaignResultHeaderLine = () => Papa.unparse({ fields: [...CAMPAIGN_RESULT_HEADER], data: [] }, CSV_OPTIONS).replace(/(\r\n)?$/, '\r\n');

/** One row of the result file as text, without its line break, exactly as campaignResultCsv writes it. */
export const campaignCsvLine = (cells: string[]) => Papa.unparse([cells], CSV_OPTIONS);

/** The cells of a line that could not be computed: "not computed: …" in the recommendation column. */
export function campaignProblemCells(p: CampaignProblem): string[] {
  const cells: string[] = new Array(CAMPAIGN_RESULT_HEADER.length).fill('');
  cells[0] = p.line === null ? '' : String(p.line);
  cells[1] = p.siteRef ?? '';
  cells[CAMPAIGN_RESULT_HEADER.indexOf('recommendation')] = `not computed: ${p.message}`;
  return cells;
}

/** The cells of a computed site. Outside the P.618 model range the engine gives a bound, not a value: the bound column says which way. */
export function campaignResultCells(r: CampaignResultRow): string[] {
  const read = readCampaignRow(r);
  return [
        String(r.line),
        r.siteRef,
        r.currentDishName,
        String(r.currentDishCm),
        read.current.minutesCell,
        read.current.boundWords,
        read.current.availabilityCell,
        VERDICT_WORDS[r.verdict],
        r.recommendedDishName ?? '',
        r.recommendedDishCm === null ? '' : String(r.recommendedDishCm),
        read.recommended?.minutesCell ?? '',
        read.recommended?.boundWords ?? '',
        read.saved?.cell ?? '',
        r.upgradePriceUsd ?? '',
        fixed(r.climate.r001MmH, 1),
        r.climate.rainClimateSource,
        fixed(r.climate.rainHeightKm, 3),
        r.climate.rainHeightSource,
        String(r.climate.altitudeM),
        ALTITUDE_SOURCE_WORDS[r.climate.altitudeSource],
        MODEL_WORDS[r.attenuationModel],
        fixed(r.currentAttenuation?.gasDb ?? null, 2),
        fixed(r.currentAttenuation?.cloudDb ?? null, 2),
        fixed(r.currentAttenuation?.rainDb ?? null, 2),
        fixed(r.currentAttenuation?.scintillationDb ?? null, 2),
        fixed(r.currentAttenuation?.totalDb ?? null, 2),
  ];
}
