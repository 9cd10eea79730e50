import 'server-only';
import { models } from '@/db/models';
import { dishTradeoff } from '@/server/engine';
import { isEngineInputError } from '@/server/engine/errors';
import type { TradeoffResult, TradeoffScenario } from '@/server/engine/tradeoff-types';
import { InvalidInputError } from '@/server/errors';
import type { TradeoffScenarioInput } from '@/server/validation/tradeoff-scenario';
import { assertApiWithinPlan } from './plan-limit';

/**
 * The integrators' trade-off: plan check (API access), then the engine, unsaved. An engine
 * refusal becomes a 422 naming the scenario field (e.g. `dishes[2].diameterM`).
 */
export async function runTradeoffForApi(companyId: number, scenario: TradeoffScenarioInput): Promise<TradeoffResult> {
  const { sequelize } = models();
  await sequelize.transaction((t) => assertApiWithinPlan(companyId, t));
  try {
    return dishTradeoff(scenario as TradeoffScenario);
  } catch (e) {
    if (isEngineInputError(e)) throw new InvalidInputError(e.message, { [e.field]: [e.message] });
    throw e;
  }
}
