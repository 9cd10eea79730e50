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
 * maps. A site the maps or the engine refuse (no map data, satellite below the horizon), or whose
 * current dish is not in the catalogue, becomes a problem on its line; the others go on.
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
  const sizes = [...new Set(o.dishes.map((d) => wholeCentimetres(d.diameterM)))].sort((a, b) => a - b).join(', ');
  for (const row of o.rows) {
    let built: ReturnType<typeof buildScenario>;
    let result: TradeoffResult;
    let site: ReturnType<typeof campaignSiteClimate>;
    try {
      site = campaignSiteClimate(row, o.climate);
      built = buildScenario({
        site: { id: null, name: row.siteRef, customerId: null, customerName: '', latDeg: row.latDeg, lonDeg: row.lonDeg, altitudeM: site.altitudeM },
        service: o.service,
        climate: site.rainClimate,
        dishes: o.dishes,
        targetAvailabilityPercent: o.targetAvailabilityPercent,
        atmosphere: site.atmosphere,
        fallbackIsothermKm: site.mapsIsothermKm,
      });
      result = dishTradeoff(built.scenario);
    } catch (e) {
      problems.push(engineProblem(row.line, row.siteRef, e));
      continue;
    }
    // Options come back in the scenario's order, which is buildScenario's sorted dish list.
    const currentIndex = built.dishes.findIndex((d) => wholeCentimetres(d.diameterM) === Math.round(row.currentDishCm));
    if (currentIndex < 0) {
      problems.push({ line: row.line, siteRef: row.siteRef, column: 'current_dish_cm', message: `Line ${row.line}, current_dish_cm: no active catalogue dish is ${row.currentDishCm} cm (the catalogue has ${sizes || 'no active dishes'} cm).` });
      continue;
    }
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
    };
    if (currentMeets) {
      results.push({ ...base, verdict: 'already-meets-target', recommendedDishName: null, recommendedDishCm: null, recommendedOutageMinutesPerYear: null, recommendedOutageBound: null, minutesSavedPerYear: null, upgradePriceUsd: null });
    } else if (rec === null) {
      results.push({ ...base, verdict: 'none-meets-target', recommendedDishName: null, recommendedDishCm: null, recommendedOutageMinutesPerYear: null, recommendedOutageBound: null, minutesSavedPerYear: null, upgradePriceUsd: null });
    } else {
      const recommended = basisFiguresOf(result.options[rec], basis);
      results.push({
        ...base,
        verdict: 'upgrade',
        recommendedDishName: built.dishes[rec].name,
        recommendedDishCm: wholeCentimetres(built.dishes[rec].diameterM),
        recommendedOutageMinutesPerYear: recommended.outageMinutesPerYear,
        recommendedOutageBound: recommended.outageBound,
        minutesSavedPerYear: current.outageMinutesPerYear - recommended.outageMinutesPerYear,
        upgradePriceUsd: result.options[rec].priceUsd,
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
