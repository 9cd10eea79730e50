import { z } from 'zod';

/**
 * The engine scenario of `POST /api/v1/tradeoff` (the TradeoffScenario type of server/engine), as
 * integrators send it. Shapes and types are checked here; physical ranges are the engine's own
 * rule (EngineInputError naming the field), so the two can never disagree.
 */
const num = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number');
const money = z.union([z.string().regex(/^\d+(\.\d{1,2})?$/, 'must be an amount like "1249.00"'), num]);

const rainHeight = { rainHeightKm: num.optional(), zeroIsothermHeightKm: num.optional() };

const rainSchema = z.union(
  [
    z.object({ r001MmH: num, ...rainHeight }).strict(),
    z.object({ monthlyRainfallMm: z.array(num).length(12), monthlyTemperatureC: z.array(num).length(12), ...rainHeight }).strict(),
    z.object({ measuredCurve: z.array(z.object({ pPercent: num, rainRateMmH: num }).strict()).min(2).max(200), ...rainHeight }).strict(),
    z.object({ climateZone: z.string().length(1), ...rainHeight }).strict(),
  ],
  { error: 'give exactly one rain climate: r001MmH, monthlyRainfallMm + monthlyTemperatureC, measuredCurve or climateZone' },
);

const modcodEntry = z.union([z.string().max(20), z.object({ name: z.string().max(40), spectralEfficiencyBitPerSymbol: num, idealEsN0Db: num }).strict()]);

export const tradeoffScenarioSchema = z
  .object({
    site: z.object({ latDeg: num, lonDeg: num, altitudeKm: num }).strict(),
    satellite: z.object({ longitudeDeg: num }).strict(),
    downlink: z
      .object({
        frequencyGHz: num,
        tiltDeg: num,
        eirpDbw: num,
        symbolRateMsps: num,
        requiredEsN0Db: num,
        implementationMarginDb: num,
        otherLossesDb: num.optional(),
        pointingErrorDeg: num.optional(),
      })
      .strict(),
    receiver: z.object({ lnbNoiseTempK: num, antennaNoiseTempK: num, mediumTempK: num.optional() }).strict(),
    rain: rainSchema,
    dishes: z
      .array(z.object({ diameterM: num, efficiency: num, priceUsd: money.optional(), labourUsd: money.optional(), hpaPowerW: num.optional() }).strict())
      .min(1, 'at least one dish')
      .max(24, 'at most 24 dishes per request'),
    targetAvailabilityPercent: num.optional(),
    uplink: z
      .object({
        frequencyGHz: num,
        tiltDeg: num,
        terminalEirpDbw: num.optional(),
        hpaPowerW: num.optional(),
        feedLossDb: num.optional(),
        satelliteGOverTDbK: num,
        symbolRateMsps: num,
        requiredEsN0Db: num,
        implementationMarginDb: num.optional(),
        otherLossesDb: num.optional(),
      })
      .strict()
      .optional(),
    acm: z.object({ modcods: z.array(modcodEntry).min(1).max(40) }).strict().optional(),
    scintillation: z.object({ nWet: num }).strict().optional(),
  })
  .strict();
export type TradeoffScenarioInput = z.infer<typeof tradeoffScenarioSchema>;
