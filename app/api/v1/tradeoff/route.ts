import { apiRoute } from '@/server/api/route';
import { tradeoffScenarioSchema } from '@/server/validation/tradeoff-scenario';
import { runTradeoffForApi } from '@/server/studies/tradeoff-api';

/**
 * POST /api/v1/tradeoff — the engine scenario (TradeoffScenario) in, dishTradeoff's result out,
 * plus `mapInputs` (what the ITU-R maps filled in); nothing is saved. For integrators: needs
 * 'tradeoff.api' and a plan with API access.
 *
 * Coordinates are enough: without `site.altitudeKm` the altitude is the ITU-R P.1511-1 height,
 * without `rain` the climate is P.837-7 Annex 1 from the ITU-R maps, without a rain height the
 * P.839-4 isotherm; the atmosphere (gases, clouds, scintillation, so outages on the P.618-14 §2.5
 * total) is always read from the maps unless the request sends `atmosphere: null` (rain only).
 * A site without map data, or a satellite below its horizon, is a 422 naming the field.
 */
export const POST = apiRoute({ permission: 'tradeoff.api', schema: tradeoffScenarioSchema }, async ({ ctx, input }) => runTradeoffForApi(ctx, input));
