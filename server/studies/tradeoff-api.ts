import 'server-only';
import { dishTradeoff } from '@/server/engine';
import { isEngineInputError } from '@/server/engine/errors';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { InvalidInputError, PlanLimitError } from '@/server/errors';
import type { TradeoffScenarioInput } from '@/server/validation/tradeoff-scenario';
import { getPlanLimits, limitMessage, type PlanLimits } from '@/server/billing/limits';
import { scenarioFromMaps, type MapInputs } from './tradeoff-scenario-from-maps';

/** The engine's result, plus what the ITU-R maps supplied that the request left out. */
export type TradeoffApiResult = TradeoffResult & { mapInputs: MapInputs };

/**
 * The integrators' trade-off: plan check (API access), the site's missing figures from the ITU-R
 * maps (scenarioFromMaps), then the engine, unsaved. A refusal of the maps or the engine becomes
 * a 422 naming the scenario field (e.g. `site.latDeg` where the maps have no data,
 * `satellite.longitudeDeg` below the horizon, `dishes[2].diameterM`).
 */
export async function runTradeoffForApi(caller: { companyId: number; plan?: PlanLimits }, input: TradeoffScenarioInput): Promise<TradeoffApiResult> {
  // Nothing is written, so no company lock: the plan as read with the caller (session or key) is
  // enough, and parallel trade-offs of one company no longer queue behind each other.
  const limits = caller.plan ?? (await getPlanLimits(caller.companyId));
  if (!limits.apiAccess) throw new PlanLimitError('apiAccess', limitMessage('apiAccess', limits, 0));
  try {
    const { scenario, mapInputs } = scenarioFromMaps(input);
    return { ...dishTradeoff(scenario), mapInputs };
  } catch (e) {
    if (isEngineInputError(e)) throw new InvalidInputError(e.message, { [e.field]: [e.message] });
    throw e;
  }
}
