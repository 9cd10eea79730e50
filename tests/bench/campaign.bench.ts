import { performance } from 'node:perf_hooks';
import { computeCampaign } from '../../server/campaigns/campaign-compute';
import { parseCampaignCsv } from '../../server/campaigns/campaign-csv';
import { campaignResultCsv } from '../../server/campaigns/campaign-result-csv';
import { bigCampaignCsv, climate, SEVEN, service } from '../unit/campaigns/campaign-fixture';

/**
 * `npm run bench:campaign`: the pure work of one upgrade-campaign request at the size limit
 * (5 000 sites × 7 dishes): parse, each site's climate and atmosphere from the ITU-R maps plus
 * the engine on the P.618 §2.5 total, result CSV. Median of 5 runs after one warm-up (the warm-up
 * also loads the maps, timed apart). Then the same with a company profile overriding the rain.
 */
const text = bigCampaignCsv(5000);

const tLoad = performance.now();
computeCampaign({ rows: parseCampaignCsv(`site_ref,latitude,longitude,current_dish_cm\nW,47,2,60\n`).rows, service, climate: null, dishes: SEVEN, targetAvailabilityPercent: 99.9 });
const firstSiteMs = performance.now() - tLoad;

function bench(override: typeof climate | null) {
  const runs: { parse: number; engine: number; csv: number; total: number }[] = [];
  for (let i = 0; i < 6; i++) {
    const t0 = performance.now();
    const parsed = parseCampaignCsv(text);
    const t1 = performance.now();
    const r = computeCampaign({ rows: parsed.rows, service, climate: override, dishes: SEVEN, targetAvailabilityPercent: 99.9 });
    const t2 = performance.now();
    campaignResultCsv(r.results, r.problems);
    const t3 = performance.now();
    if (i > 0) runs.push({ parse: t1 - t0, engine: t2 - t1, csv: t3 - t2, total: t3 - t0 });
  }
  const median = (k: keyof (typeof runs)[number]) => runs.map((r) => r[k]).sort((a, b) => a - b)[Math.floor(runs.length / 2)];
  return `parse ${median('parse').toFixed(0)} ms · maps + engine ${median('engine').toFixed(0)} ms · result CSV ${median('csv').toFixed(0)} ms · total ${median('total').toFixed(0)} ms   aim < 3 s: ${median('total') < 3000 ? 'met' : 'NOT met'}`;
}

console.log(`Upgrade campaign, 5 000 sites × 7 dishes (Node ${process.version}, one core), median of 5:`);
console.log(`  first site (loads the ITU-R maps): ${firstSiteMs.toFixed(0)} ms`);
console.log(`  each site's own climate (default): ${bench(null)}`);
console.log(`  rain climate overridden by a profile: ${bench(climate)}`);
