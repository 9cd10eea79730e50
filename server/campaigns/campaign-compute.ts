import Decimal from 'decimal.js';
import { dishTradeoff, isEngineInputError } from '@/server/engine';
import type { AttenuationComponents } from '@/server/engine/p618-total-attenuation';
import type { ExceedanceBound } from '@/server/engine/p618-rain-path';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { basisFiguresOf, meetsTarget, wholeCentimetres } from '@/server/study-option';
import { buildScenario } from '@/server/studies/build-scenario';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot } from '@/server/studies/snapshot';
import type { CampaignProblem, CampaignSiteRow } from './campaign-csv';
import { campaignSiteClimate, type CampaignSiteClimate } from './campaign-site-climate';

export type CampaignVerdict = 'upgrade' | 'already-meets-target' | 'none-meets-target';

/** One site of the campaign, computed. Minutes are per average year (ITU-R P.618 statistics). */
export interface CampaignResultRow {
  line: number;
  siteRef: string;
  currentDishCm: number;
  currentDishName: string;
  /** False when the current dish does not receive (or, two-way, send) the service even in clear sky. */
  currentCloses: boolean;
  currentOutageMinutesPerYear: number;
  /** 'below-model-range': the minutes are an upper bound; 'above-model-range': a lower bound (engine convention). */
  currentOutageBound: ExceedanceBound;
  currentAvailabilityPercent: number;
  /** The service has an uplink: outages are two-way sums p_up + p_down, upper bounds (server/engine/README.md §4). */
  outageIsTwoWaySum: boolean;
  verdict: CampaignVerdict;
  recommendedDishName: string | null;
  recommendedDishCm: number | null;
  recommendedOutageMinutesPerYear: number | null;
  recommendedOutageBound: ExceedanceBound | null;
  minutesSavedPerYear: number | null;
  /** Hardware + labour of the recommended dish, USD (exact decimal string); null when no upgrade. */
  upgradePriceUsd: string | null;
  /** The two parts of upgradePriceUsd (exact decimal strings), for the campaign's totals. */
  upgradeHardwareUsd: string | null;
  upgradeLabourUsd: string | null;
  /** True when the current dish is not in the catalogue and was computed with CURRENT_DISH_DEFAULT_EFFICIENCY. */
  currentDishAssumed: boolean;
  /** The climate this site was computed with, and where each figure came from. */
  climate: CampaignSiteClimate;
  /** 'total': outages on the P.618-14 §2.5 total (gases, clouds, rain, scintillation); 'rain': rain only (low elevation). */
  attenuationModel: TradeoffResult['attenuationModel'];
  /**
   * Gas, cloud, rain and scintillation of the current dish's DOWNLINK at its outage, with their
   * total (≈ its fade threshold); null for rain-only rows and dishes that do not close.
   */
  currentAttenuation: AttenuationComponents | null;
}

export interface CampaignOutcome {
  results: CampaignResultRow[];
  problems: CampaignProblem[];
  counts: { rows: number; computed: number; upgrade: number; alreadyMeetsTarget: number; noneMeetsTarget: number; problems: number };
}

/**
 * Aperture efficiency given to a current dish whose size is not in the catalogue (an old 45 cm
 * dish, say): 65 %, a usual figure for a consumer offset reflector with its feed — common
 * practice, no source. Stated beside every such row (currentDishName) and on the campaign page.
 */
export const CURRENT_DISH_DEFAULT_EFFICIENCY = 0.65;

/** The name a current dish outside the catalogue is shown with, its assumption in words. */
export function assumedCurrentDishName(cm: number): string {
  return `current ${cm} cm dish (not in the catalogue; ${Math.round(CURRENT_DISH_DEFAULT_EFFICIENCY * 100)} % efficiency assumed)`;
}

type DishPrice = { hardware: string; labour: string; total: string };

/**
 * Each catalogue dish's installed price, once per call rather than once per site and option:
 * the engine runs without prices (its economics would only feed the per-study best-value pick,
 * which a campaign does not use) and a recommendation reads its price from here. Same exact
 * decimal arithmetic as the engine (hardware + labour, 2 places).
 */
function dishPrices(dishes: DishSnapshot[]): Map<string, DishPrice> {
  const out = new Map<string, DishPrice>();
  for (const d of dishes) {
    out.set(dishKey(d), { hardware: new Decimal(d.hardwarePrice).toFixed(2), labour: new Decimal(d.labourPrice).toFixed(2), total: new Decimal(d.hardwarePrice).plus(d.labourPrice).toFixed(2) });
  }
  return out;
}
const dishKey = (d: Pick<DishSnapshot, 'name' | 'diameterM' | 'efficiency'>) => `${d.diameterM}|${d.efficiency}|${d.name}`;

const PLAIN: [RegExp, string][] = [
  [/below the horizon/, 'the satellite is below the horizon at this site; no dish can see it. Check the coordinates or the service.'],
  [/no ITU-R map data/, 'the ITU-R maps have no climate data at these coordinates (and no geostationary satellite is in view there). Check the coordinates.'],
];

function engineProblem(line: number, siteRef: string, error: unknown): CampaignProblem {
  if (!isEngineInputError(error)) throw error;
  const plain = PLAIN.find(([re]) => re.test(error.message))?.[1];
  return { line, siteRef, message: `Line ${line}: ${plain ?? `cannot be computed (${error.message}).`}` };
}

/**
 * Every site of a campaign through the engine, with the same scenario building as a study
 * (buildScenario), over the company's active catalogue, each site with its own climate and
 * atmosphere from the ITU-R maps at its coordinates (campaignSiteClimate). No database; reads the
 * maps. A current dish of a size not in the catalogue is computed with CURRENT_DISH_DEFAULT_EFFICIENCY
 * (and never recommended). A site the maps or the engine refuse (no map data, satellite below the
 * horizon) becomes a problem on its line; the others go on.
 */
export function computeCampaign(o: {
  rows: CampaignSiteRow[];
  service: ServiceSnapshot;
  /** A company profile overriding the RAIN climate of every site; null: each site's own, from the maps. */
  climate: ClimateSnapshot | null;
  dishes: DishSnapshot[];
  targetAvailabilityPercent: number;
  /** Problems found while reading the file, merged by line into the outcome. */
  fileProblems?: CampaignProblem[];
  rowCount?: number;
}): CampaignOutcome {
  const problems: CampaignProblem[] = [...(o.fileProblems ?? [])];
  const results: CampaignResultRow[] = [];
  const prices = dishPrices(o.dishes);
  const catalogueCm = new Set(o.dishes.map((d) => wholeCentimetres(d.diameterM)));
  for (const row of o.rows) {
    // A current size outside the catalogue is computed as one more dish, with a stated efficiency.
    const currentCm = Math.round(row.currentDishCm);
    const assumed = !catalogueCm.has(currentCm);
    const dishes = assumed
      ? [...o.dishes, { dishId: null, name: assumedCurrentDishName(currentCm), diameterM: currentCm / 100, efficiency: CURRENT_DISH_DEFAULT_EFFICIENCY, hardwarePrice: '0.00', labourPrice: '0.00', mountNotes: null }]
      : o.dishes;
    let built: ReturnType<typeof buildScenario>;
    let result: TradeoffResult;
    let site: ReturnType<typeof campaignSiteClimate>;
    try {
      site = campaignSiteClimate(row, o.climate);
      built = buildScenario({
        site: { id: null, name: row.siteRef, customerId: null, customerName: '', latDeg: row.latDeg, lonDeg: row.lonDeg, altitudeM: site.altitudeM },
        service: o.service,
        rain: site.rain,
        dishes,
        targetAvailabilityPercent: o.targetAvailabilityPercent,
        atmosphere: site.atmosphere,
      });
      result = dishTradeoff({ ...built.scenario, dishes: built.scenario.dishes.map((d) => ({ diameterM: d.diameterM, efficiency: d.efficiency })) });
    } catch (e) {
      problems.push(engineProblem(row.line, row.siteRef, e));
      continue;
    }
    // Options come back in the scenario's order, which is buildScenario's sorted dish list.
    const currentIndex = assumed
      ? built.dishes.findIndex((d) => d.dishId === null && d.name === assumedCurrentDishName(currentCm))
      : built.dishes.findIndex((d) => wholeCentimetres(d.diameterM) === currentCm);
    // The outage the recommendation is made on: two-way when the service has an uplink.
    const basis = result.recommendation.basis;
    const current = basisFiguresOf(result.options[currentIndex], basis);
    const meets = (k: number) => meetsTarget(basisFiguresOf(result.options[k], basis).closes, result.options[k].meetsTarget);
    const currentMeets = meets(currentIndex);
    // The engine's pick (smallest meeting the target); should a smaller dish of better efficiency
    // meet it while the current one does not, an upgrade is still a larger dish.
    const enginePick = result.recommendation.smallestMeetingTargetIndex;
    const currentDiameter = built.dishes[currentIndex].diameterM;
    const rec =
      enginePick !== null && built.dishes[enginePick].diameterM > currentDiameter
        ? enginePick
        : (() => {
            const i = result.options.findIndex((_, k) => meets(k) && built.dishes[k].diameterM > currentDiameter);
            return i < 0 ? null : i;
          })();
    const base = {
      line: row.line,
      siteRef: row.siteRef,
      currentDishCm: wholeCentimetres(built.dishes[currentIndex].diameterM),
      currentDishName: built.dishes[currentIndex].name,
      currentCloses: current.closes,
      currentOutageMinutesPerYear: current.outageMinutesPerYear,
      currentOutageBound: current.outageBound,
      currentAvailabilityPercent: current.availabilityPercent,
      outageIsTwoWaySum: current.isUpperBound,
      climate: site.describe(result),
      attenuationModel: result.attenuationModel,
      currentAttenuation: result.options[currentIndex].attenuationAtOutage,
      currentDishAssumed: assumed,
    };
    const none = { recommendedDishName: null, recommendedDishCm: null, recommendedOutageMinutesPerYear: null, recommendedOutageBound: null, minutesSavedPerYear: null, upgradePriceUsd: null, upgradeHardwareUsd: null, upgradeLabourUsd: null };
    if (currentMeets) {
      results.push({ ...base, verdict: 'already-meets-target', ...none });
    } else if (rec === null) {
      results.push({ ...base, verdict: 'none-meets-target', ...none });
    } else {
      const recommended = basisFiguresOf(result.options[rec], basis);
      const price = prices.get(dishKey(built.dishes[rec]))!;
      results.push({
        ...base,
        verdict: 'upgrade',
        recommendedDishName: built.dishes[rec].name,
        recommendedDishCm: wholeCentimetres(built.dishes[rec].diameterM),
        recommendedOutageMinutesPerYear: recommended.outageMinutesPerYear,
        recommendedOutageBound: recommended.outageBound,
        minutesSavedPerYear: current.outageMinutesPerYear - recommended.outageMinutesPerYear,
        upgradePriceUsd: price.total,
        upgradeHardwareUsd: price.hardware,
        upgradeLabourUsd: price.labour,
      });
    }
  }
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
  const count = (v: CampaignVerdict) => results.filter((r) => r.verdict === v).length;
  return {
    results,
    problems,
    counts: {
      rows: o.rowCount ?? o.rows.length,
      computed: results.length,
      upgrade: count('upgrade'),
      alreadyMeetsTarget: count('already-meets-target'),
      noneMeetsTarget: count('none-meets-target'),
      problems: problems.length,
    },
  };
}
