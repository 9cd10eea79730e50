import { apiRoute } from '@/server/api/route';
import { tradeoffScenarioSchema } from '@/server/validation/tradeoff-scenario';
import { runTradeoffForApi } from '@/server/studies/tradeoff-api';

/**
 * POST /api/v1/tradeoff — the engine scenario (TradeoffScenario, issue 3) in, dishTradeoff's
 * result out; nothing is saved. For integrators: needs 'tradeoff.api' and a plan with API access.
 */
export const POST = apiRoute({ permission: 'tradeoff.api', schema: tradeoffScenarioSchema }, async ({ ctx, input }) => runTradeoffForApi(ctx.companyId, input));
