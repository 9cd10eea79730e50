import Papa from 'papaparse';
import type { CampaignResultRow, CampaignVerdict } from './campaign-compute';

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
] as const;

/** Outside the P.618 model range the engine gives a bound, not a value: the file says which way. */
const BOUND_WORDS = { none: '', 'below-model-range': 'at most', 'above-model-range': 'at least' } as const;
const boundWords = (b: keyof typeof BOUND_WORDS | null) => (b === null ? '' : BOUND_WORDS[b]);

const fixed = (n: number | null, digits: number) => (n === null ? '' : n.toFixed(digits));

/**
 * The campaign as CSV (papaparse unparse), one line per computed site, then the problems as
 * lines with the recommendation column "not computed: …" so nothing in the file is dropped silently.
 */
export function campaignResultCsv(results: CampaignResultRow[], problems: { line: number | null; message: string }[] = []): string {
  const data: string[][] = results.map((r) => [
    String(r.line),
    r.siteRef,
    r.currentDishName,
    String(r.currentDishCm),
    fixed(r.currentOutageMinutesPerYear, 1),
    boundWords(r.currentOutageBound),
    fixed(r.currentAvailabilityPercent, 4),
    VERDICT_WORDS[r.verdict],
    r.recommendedDishName ?? '',
    r.recommendedDishCm === null ? '' : String(r.recommendedDishCm),
    fixed(r.recommendedOutageMinutesPerYear, 1),
    boundWords(r.recommendedOutageBound),
    fixed(r.minutesSavedPerYear, 1),
    r.upgradePriceUsd ?? '',
  ]);
  for (const p of problems) {
    const row: string[] = new Array(CAMPAIGN_RESULT_HEADER.length).fill('');
    row[0] = p.line === null ? '' : String(p.line);
    row[CAMPAIGN_RESULT_HEADER.indexOf('recommendation')] = `not computed: ${p.message}`;
    data.push(row);
  }
  return Papa.unparse({ fields: [...CAMPAIGN_RESULT_HEADER], data }, { newline: '\r\n', escapeFormulae: true });
}
