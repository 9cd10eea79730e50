import { dishTradeoff, ENGINE_VERSION, rainAttenuation } from '@/server/engine';
import type { ExceedancePoint, StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';
import { buildScenario } from './build-scenario';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot, SiteSnapshot } from './snapshot';

/** ITU-R P.618-14 step 10 holds for 0.001 ≤ p ≤ 5 %; the curve spans exactly that range. */
const CURVE_P_MIN = 0.001;
const CURVE_P_MAX = 5;
const CURVE_POINTS = 41;

/** Downlink rain attenuation exceeded for p % of the year, log-spaced p over the model range. */
export function exceedanceCurve(inputs: StudyInputsSnapshot, result: { elevationDeg: number; rainHeightKm: number; climateSource: { r001MmH: number } }): ExceedancePoint[] {
  const sc = inputs.scenario;
  const points: ExceedancePoint[] = [];
  const lo = Math.log10(CURVE_P_MIN);
  const hi = Math.log10(CURVE_P_MAX);
  for (let i = 0; i < CURVE_POINTS; i++) {
    const pPercent = Number((10 ** (lo + ((hi - lo) * i) / (CURVE_POINTS - 1))).toPrecision(6));
    const attenuationDb = rainAttenuation({
      latDeg: sc.site.latDeg,
      stationHeightKm: sc.site.altitudeKm,
      frequencyGHz: sc.downlink.frequencyGHz,
      elevationDeg: result.elevationDeg,
      tiltDeg: sc.downlink.tiltDeg,
      r001MmH: result.climateSource.r001MmH,
      rainHeightKm: result.rainHeightKm,
      pPercent,
    });
    points.push({ pPercent, attenuationDb });
  }
  return points;
}

/**
 * The one place a study is computed: snapshot the inputs, run the engine's dishTradeoff and the
 * exceedance curve, stamp the engine version. Pure (no database): EngineInputError passes through
 * for the caller to turn into a form error.
 */
export function computeStudy(o: {
  site: SiteSnapshot;
  service: ServiceSnapshot;
  climate: ClimateSnapshot;
  dishes: DishSnapshot[];
  targetAvailabilityPercent: number;
  now?: Date;
}): { inputs: StudyInputsSnapshot; result: StudyResultSnapshot } {
  const built = buildScenario(o);
  const inputs: StudyInputsSnapshot = {
    schemaVersion: 1,
    site: o.site,
    service: o.service,
    climate: o.climate,
    dishes: built.dishes,
    targetAvailabilityPercent: o.targetAvailabilityPercent,
    downlinkTiltDeg: built.downlinkTiltDeg,
    scenario: built.scenario,
  };
  const tradeoff = dishTradeoff(built.scenario);
  const result: StudyResultSnapshot = {
    schemaVersion: 1,
    engineVersion: ENGINE_VERSION,
    computedAt: (o.now ?? new Date()).toISOString(),
    tradeoff,
    exceedanceCurve: exceedanceCurve(inputs, tradeoff),
  };
  return { inputs, result };
}
