import { dishTradeoff, ENGINE_VERSION, rainAttenuation } from '@/server/engine';
import { slantPathTotalCurve } from '@/server/engine/p618-total-attenuation';
import type { SiteAtmosphere } from '@/server/engine/site-atmosphere';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import type { ExceedancePoint, StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';
import { buildScenario } from './build-scenario';
import { readSiteMaps } from './maps-climate';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot, SiteSnapshot } from './snapshot';

/** ITU-R P.618-14 step 10 holds for 0.001 ≤ p ≤ 5 %; the curve spans exactly that range. */
const CURVE_P_MIN = 0.001;
const CURVE_P_MAX = 5;
const CURVE_POINTS = 41;

/** 41 log-spaced p over the model range, rounded so the stored JSON stays short. */
function curvePercentages(): number[] {
  const lo = Math.log10(CURVE_P_MIN);
  const hi = Math.log10(CURVE_P_MAX);
  return Array.from({ length: CURVE_POINTS }, (_, i) => Number((10 ** (lo + ((hi - lo) * i) / (CURVE_POINTS - 1))).toPrecision(6)));
}

/** Downlink rain attenuation exceeded for p % of the year, log-spaced p over the model range (rain-only studies). */
export function exceedanceCurve(inputs: StudyInputsSnapshot, result: { elevationDeg: number; rainHeightKm: number; climateSource: { r001MmH: number } }): ExceedancePoint[] {
  const sc = inputs.scenario;
  return curvePercentages().map((pPercent) => ({
    pPercent,
    attenuationDb: rainAttenuation({
      latDeg: sc.site.latDeg,
      stationHeightKm: sc.site.altitudeKm,
      frequencyGHz: sc.downlink.frequencyGHz,
      elevationDeg: result.elevationDeg,
      tiltDeg: sc.downlink.tiltDeg,
      r001MmH: result.climateSource.r001MmH,
      rainHeightKm: result.rainHeightKm,
      pPercent,
    }),
  }));
}

/** The option the total curve is drawn for: the recommended dish, else the smallest (index 0: options run small to large). */
function curveOptionIndex(tradeoff: Pick<TradeoffResult, 'recommendation'>): number {
  return tradeoff.recommendation.smallestMeetingTargetIndex ?? 0;
}

/**
 * The downlink TOTAL attenuation (ITU-R P.618-14 §2.5) exceeded for p % of the year, with gas,
 * cloud, rain and scintillation beside it, for one dish (scintillation depends on its aperture).
 * Built from the same engine paths dishTradeoff uses, so the curve meets each fade threshold where
 * that dish's outage lies.
 */
function totalExceedanceCurve(inputs: StudyInputsSnapshot, tradeoff: TradeoffResult, atmosphere: SiteAtmosphere, optionIndex: number): ExceedancePoint[] {
  const sc = inputs.scenario;
  const dish = sc.dishes[optionIndex];
  const curve = slantPathTotalCurve({
    latDeg: sc.site.latDeg,
    stationHeightKm: sc.site.altitudeKm,
    frequencyGHz: sc.downlink.frequencyGHz,
    elevationDeg: tradeoff.elevationDeg,
    tiltDeg: sc.downlink.tiltDeg,
    r001MmH: tradeoff.climateSource.r001MmH,
    rainHeightKm: tradeoff.rainHeightKm,
    atmosphere,
    diameterM: dish.diameterM,
    efficiency: dish.efficiency,
  });
  return curvePercentages().map((pPercent) => {
    const c = curve.componentsAt(pPercent);
    return { pPercent, attenuationDb: c.totalDb, gasDb: c.gasDb, cloudDb: c.cloudDb, rainDb: c.rainDb, scintillationDb: c.scintillationDb };
  });
}

/**
 * The one place a study is computed: read the ITU-R maps at the site (gases, clouds and
 * scintillation always; the rain climate too unless an override profile is given), snapshot the
 * inputs, run the engine's dishTradeoff and the exceedance curve, stamp the engine version.
 * No database: EngineInputError passes through for the caller to turn into a form error (a site
 * without map data is one, on `site.latDeg`).
 */
export function computeStudy(o: {
  site: SiteSnapshot;
  service: ServiceSnapshot;
  /** An override of the RAIN climate (a company profile); null = the ITU-R maps at the site, the default. */
  climate: ClimateSnapshot | null;
  dishes: DishSnapshot[];
  targetAvailabilityPercent: number;
  now?: Date;
}): { inputs: StudyInputsSnapshot; result: StudyResultSnapshot } {
  const maps = readSiteMaps(o.site.latDeg, o.site.lonDeg, o.site.altitudeM / 1000);
  const climate = o.climate ?? maps.climate;
  // An override without its own 0 °C isotherm takes the P.839-4 map value, never the latitude rule.
  const isothermUsed = climate.kind === 'itu-r-maps' || climate.zeroIsothermKm === null;
  const built = buildScenario({ ...o, climate, atmosphere: maps.atmosphere, fallbackIsothermKm: maps.siteMaps.isothermHeightKm });
  const inputs: StudyInputsSnapshot = {
    schemaVersion: 1,
    site: o.site,
    service: o.service,
    climate,
    dishes: built.dishes,
    targetAvailabilityPercent: o.targetAvailabilityPercent,
    downlinkTiltDeg: built.downlinkTiltDeg,
    scenario: built.scenario,
    siteMaps: { ...maps.siteMaps, isothermUsed },
  };
  const tradeoff = dishTradeoff(built.scenario);
  // Below 5° elevation the engine skips gases and clouds ('rain' model): the curve is then rain only.
  const curveIndex = tradeoff.attenuationModel === 'total' ? curveOptionIndex(tradeoff) : null;
  const result: StudyResultSnapshot = {
    schemaVersion: 1,
    engineVersion: ENGINE_VERSION,
    computedAt: (o.now ?? new Date()).toISOString(),
    tradeoff,
    exceedanceCurve: curveIndex === null ? exceedanceCurve(inputs, tradeoff) : totalExceedanceCurve(inputs, tradeoff, maps.atmosphere, curveIndex),
    ...(curveIndex === null ? {} : { exceedanceCurveOptionIndex: curveIndex }),
  };
  return { inputs, result };
}
