import 'server-only';
import { models } from '@/db/models';
import { dishTradeoff } from '@/server/engine';
import { isEngineInputError } from '@/server/engine/errors';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { InvalidInputError } from '@/server/errors';
import type { TradeoffScenarioInput } from '@/server/validation/tradeoff-scenario';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { scenarioFromMaps, type MapInputs } from './tradeoff-scenario-from-maps';

/** The engine's result, plus what the ITU-R maps supplied that the request left out. */
export type TradeoffApiResult = TradeoffResult & { mapInputs: MapInputs };

/**
 * The integrators' trade-off: plan check (API access), the site's missing figures from the ITU-R
 * maps (scenarioFromMaps), then the engine, unsaved. A refusal of the maps or the engine becomes
 * a 422 naming the scenario field (e.g. `site.latDeg` where the maps have no data,
 * `satellite.longitudeDeg` below the horizon, `dishes[2].diameterM`).
 */
export async function runTradeoffForApi(companyId: number, input: TradeoffScenarioInput): Promise<TradeoffApiResult> {
  const { sequelize } = models();
  await sequelize.transaction(async (t) => assertWithinPlan(await lockCompanyRow(companyId, t), 'apiAccess'));
  try {
    const { scenario, mapInputs } = scenarioFromMaps(input);
    return { ...dishTradeoff(scenario), mapInputs };
  } catch (e) {
    if (isEngineInputError(e)) throw new InvalidInputError(e.message, { [e.field]: [e.message] });
    throw e;
  }
}
