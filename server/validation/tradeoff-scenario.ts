import { z } from 'zod';
import { PHYSICAL_RANGES as R } from '@/server/engine/physical-ranges';
import { MAX_FREQUENCY_GHZ_P618_14, MIN_FREQUENCY_GHZ_P618_14 } from '@/server/engine/p618-rain-path';
import { MAX_STATION_HEIGHT_KM, MIN_STATION_HEIGHT_KM } from '@/server/climate-maps/site-input';
import { moneyField } from './fields';

/**
 * The engine scenario of `POST /api/v1/tradeoff` (the TradeoffScenario type of server/engine), as
 * integrators send it. Every number has its physical range here, taken from the engine's own
 * constants (PHYSICAL_RANGES, the P.618-14 frequency range, the maps' station heights) so the two
 * cannot drift; the engine checks them again and refuses what only it can judge (a measured curve
 * that does not reach 0.01 %, normals that give an absurd R0.01, a satellite below the horizon).
 *
 * What may be left out, and is then read from the ITU-R maps at the site's coordinates
 * (server/studies/tradeoff-scenario-from-maps.ts):
 * - `site.altitudeKm` → the ITU-R P.1511-1 topographic height;
 * - `rain` → P.837-7 Annex 1 from the P.837-7 rainfall and P.1510-1 temperature maps;
 * - a rain height (`rainHeightKm` / `zeroIsothermHeightKm`) → the P.839-4 0 °C isotherm;
 * - `atmosphere` → always read from the maps (gases, clouds, scintillation: outages on the
 *   P.618-14 §2.5 total); send `atmosphere: null` for the rain-only figures of earlier versions.
 */

/** Ranges the engine checks inline rather than in PHYSICAL_RANGES (dish-tradeoff.ts); same figures. */
const LAT_DEG = { min: -90, max: 90 };
/** The maps take −180…360° (site-input.ts); the engine −360…360°. The narrower one holds. */
const LON_DEG = { min: -180, max: 360 };
const SATELLITE_LON_DEG = { min: -360, max: 360 };
const POINTING_ERROR_DEG = { min: 0, max: 10 };
const TARGET_AVAILABILITY_PERCENT = { min: 0, max: 100 };
const N_WET = { min: 0, max: 200 };
/** P.839 heights the engine accepts (p839-rain-height.ts): h0 −1…10 km, hR = h0 + 0.36 km. */
const ISOTHERM_HEIGHT_KM = { min: -1, max: 10 };
const RAIN_HEIGHT_KM = { min: -1, max: 10.36 };
/** Monthly mean surface temperature, °C (p837-7-monthly-climate.ts). */
const MONTHLY_TEMPERATURE_C = { min: -90, max: 60 };
/** Custom MODCOD spectral efficiency, bit/symbol (dish-tradeoff.ts). */
const SPECTRAL_EFFICIENCY = { min: 0.01, max: 10 };
/** A dish price or labour of a single terminal: generous for gateway antennas, never a float overflow. */
export const TRADEOFF_MONEY_MAX_USD = '10000000.00';

/** A JSON number within [min, max], the message naming the range and unit. */
function within(range: { min: number; max: number }, unit = '') {
  const u = unit ? ` ${unit}` : '';
  return z
    .number({ error: 'must be a number' })
    .refine(Number.isFinite, 'must be a finite number')
    .refine((n) => n >= range.min && n <= range.max, `must be between ${range.min} and ${range.max}${u}`)
    // The refinement is invisible to JSON Schema: the OpenAPI document reads the range from here.
    .meta({ minimum: range.min, maximum: range.max, ...(unit ? { description: `Unit: ${unit}` } : {}) });
}
/** Strictly above min (efficiency, probability), at most max. */
function above(min: number, max: number, unit = '') {
  const u = unit ? ` ${unit}` : '';
  return z
    .number({ error: 'must be a number' })
    .refine(Number.isFinite, 'must be a finite number')
    .refine((n) => n > min && n <= max, `must be above ${min} and at most ${max}${u}`)
    .meta({ exclusiveMinimum: min, maximum: max, ...(unit ? { description: `Unit: ${unit}` } : {}) });
}

const money = moneyField('Price in USD', TRADEOFF_MONEY_MAX_USD);

const rainHeight = { rainHeightKm: within(RAIN_HEIGHT_KM, 'km').optional(), zeroIsothermHeightKm: within(ISOTHERM_HEIGHT_KM, 'km').optional() };

const rainSchema = z.union(
  [
    z.object({ r001MmH: within(R.r001MmH, 'mm/h'), ...rainHeight }).strict(),
    z
      .object({
        monthlyRainfallMm: z.array(within(R.monthlyRainfallMm, 'mm')).length(12, 'give 12 monthly values, January to December'),
        monthlyTemperatureC: z.array(within(MONTHLY_TEMPERATURE_C, '°C')).length(12, 'give 12 monthly values, January to December'),
        ...rainHeight,
      })
      .strict(),
    z
      .object({
        measuredCurve: z
          .array(z.object({ pPercent: above(0, 100, '%'), rainRateMmH: above(0, R.measuredRainRateMmH.max, 'mm/h') }).strict())
          .min(2)
          .max(200),
        ...rainHeight,
      })
      .strict(),
    z.object({ climateZone: z.string().length(1), ...rainHeight }).strict(),
  ],
  { error: 'give at most one rain climate: r001MmH, monthlyRainfallMm + monthlyTemperatureC, measuredCurve or climateZone (or none: read from the ITU-R maps at the site)' },
);

const modcodEntry = z.union([
  z.string().max(20),
  z.object({ name: z.string().max(40), spectralEfficiencyBitPerSymbol: within(SPECTRAL_EFFICIENCY, 'bit/symbol'), idealEsN0Db: within(R.esN0Db, 'dB') }).strict(),
]);

export const tradeoffScenarioSchema = z
  .object({
    site: z
      .object({
        latDeg: within(LAT_DEG, '°'),
        lonDeg: within(LON_DEG, '°'),
        altitudeKm: within({ min: MIN_STATION_HEIGHT_KM, max: MAX_STATION_HEIGHT_KM }, 'km').optional(),
      })
      .strict(),
    satellite: z.object({ longitudeDeg: within(SATELLITE_LON_DEG, '°') }).strict(),
    downlink: z
      .object({
        frequencyGHz: within({ min: MIN_FREQUENCY_GHZ_P618_14, max: MAX_FREQUENCY_GHZ_P618_14 }, 'GHz'),
        tiltDeg: within(R.tiltDeg, '°'),
        eirpDbw: within(R.eirpDbw, 'dBW'),
        symbolRateMsps: within(R.symbolRateMsps, 'Msps'),
        requiredEsN0Db: within(R.esN0Db, 'dB'),
        implementationMarginDb: within(R.marginDb, 'dB'),
        otherLossesDb: within(R.otherLossesDb, 'dB').optional(),
        pointingErrorDeg: within(POINTING_ERROR_DEG, '°').optional(),
      })
      .strict(),
    receiver: z
      .object({
        lnbNoiseTempK: within(R.lnbNoiseTempK, 'K'),
        antennaNoiseTempK: within(R.antennaNoiseTempK, 'K'),
        mediumTempK: within(R.mediumTempK, 'K').optional(),
      })
      .strict(),
    rain: rainSchema.optional(),
    dishes: z
      .array(
        z
          .object({
            diameterM: within(R.diameterM, 'm'),
            efficiency: above(0, 1),
            priceUsd: money.optional(),
            labourUsd: money.optional(),
            hpaPowerW: within(R.hpaPowerW, 'W').optional(),
          })
          .strict(),
      )
      .min(1, 'at least one dish')
      .max(24, 'at most 24 dishes per request'),
    targetAvailabilityPercent: within(TARGET_AVAILABILITY_PERCENT, '%').optional(),
    uplink: z
      .object({
        frequencyGHz: within({ min: MIN_FREQUENCY_GHZ_P618_14, max: MAX_FREQUENCY_GHZ_P618_14 }, 'GHz'),
        tiltDeg: within(R.tiltDeg, '°'),
        terminalEirpDbw: within(R.terminalEirpDbw, 'dBW').optional(),
        hpaPowerW: within(R.hpaPowerW, 'W').optional(),
        feedLossDb: within(R.feedLossDb, 'dB').optional(),
        satelliteGOverTDbK: within(R.satelliteGOverTDbK, 'dB/K'),
        symbolRateMsps: within(R.symbolRateMsps, 'Msps'),
        requiredEsN0Db: within(R.esN0Db, 'dB'),
        implementationMarginDb: within(R.marginDb, 'dB').optional(),
        otherLossesDb: within(R.otherLossesDb, 'dB').optional(),
      })
      .strict()
      .optional(),
    acm: z.object({ modcods: z.array(modcodEntry).min(1).max(40) }).strict().optional(),
    scintillation: z.object({ nWet: within(N_WET) }).strict().optional(),
    /** Omitted: read from the ITU-R maps at the site. null: rain only (no gases, clouds or scintillation). */
    atmosphere: z.null({ error: 'leave atmosphere out (read from the ITU-R maps at the site) or send null for rain-only figures' }).optional(),
  })
  .strict();
export type TradeoffScenarioInput = z.infer<typeof tradeoffScenarioSchema>;
