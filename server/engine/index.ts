/**
 * FadeLedger trade-off engine: pure functions, no I/O, no framework imports (server/engine/README.md).
 * The names in the first block are the engine's main entry points; the rest are the methods and
 * helpers the product may use (tables, helpers, types).
 *
 * @example
 * import { rainAttenuation, dishTradeoff, ENGINE_VERSION } from '@/server/engine';
 */
export { rainCoefficients } from './p838-rain-coefficients';
export { rainSpecificAttenuation } from './p838-specific-attenuation';
export { rainAttenuation } from './p618-rain-attenuation';
export { rainExceedance } from './p618-rain-exceedance';
export { monthlyRainClimate } from './p837-7-monthly-climate';
export { scintillationFade } from './p618-scintillation';
export { geoLookAngles } from './geo-look-angles';
export { dishTradeoff } from './dish-tradeoff';

export { ENGINE_VERSION } from './version';
export { EngineInputError, isEngineInputError } from './errors';

export {
  CLIMATE_ZONES,
  CLIMATE_ZONE_P_PERCENT_P837_1,
  CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1,
  climateZoneRainRate,
  isClimateZone,
} from './p837-1-climate-zones';
export { DAYS_PER_MONTH_P837_7 } from './p837-7-monthly-climate';
export { measuredRainCurve } from './measured-rain-curve';
export { resolveRainClimate } from './rain-climate-source';
export { DVB_S2_MODCODS, findModcod } from './dvb-s2-modcods';
export { WORST_MONTH_BETA_P841, WORST_MONTH_Q1_P841, worstMonthPercent } from './p841-worst-month';
export {
  RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4,
  latitudeIsothermHeight,
  rainHeightFromIsotherm,
  resolveRainHeight,
} from './p839-rain-height';
export {
  MAX_FREQUENCY_GHZ_P618_14,
  MAX_P_PERCENT_P618_14,
  MIN_FREQUENCY_GHZ_P618_14,
  MIN_P_PERCENT_P618_14,
  prepareRainPath,
} from './p618-rain-path';
export { combinedFadeExceedance } from './p618-combined-fade';
export { HELD_BELOW_P_PERCENT_P618_14, MIN_ELEVATION_DEG_ATMOSPHERE, prepareAtmosphericPath, totalAttenuationCurve } from './p618-total-attenuation';
export { gasSpecificAttenuation } from './p676-12-specific-attenuation';
export { gasSlantPathAttenuation } from './p676-12-gas-slant-path';
export { standardPressureHpaP835 } from './p835-standard-pressure';
export { CLOUD_LIQUID_TEMPERATURE_K_P840_8, cloudAttenuation, cloudMassAbsorption } from './p840-8-cloud-attenuation';
export { atmosphereAt, checkSiteAtmosphere } from './site-atmosphere';
export { PHYSICAL_RANGES } from './physical-ranges';
export { SolverNumericError } from './math/brent';
export { dishGain } from './dish-gain';
export { BEAMWIDTH_FACTOR_DEG, dishBeamwidth } from './dish-beamwidth';
export { POINTING_LOSS_COEFFICIENT_DB, pointingLoss } from './pointing-loss';
export { freeSpaceLoss } from './free-space-loss';
export { MEDIUM_TEMPERATURE_K_DEFAULT, downlinkDegradation, systemNoiseTemperature } from './system-noise';
export { fadeThreshold } from './fade-threshold';
export { linkBudget } from './link-budget';
export { acmEnvelope, acmThroughput } from './acm-throughput';
export { outageFigures } from './outage-figures';
export { parseMoneyUsd } from './money';
export { DIMINISHING_RETURNS_SHARE, meetsTargetAvailability } from './tradeoff-recommendation';
export { EARTH_RADIUS_KM_WGS84, GEOSTATIONARY_RADIUS_KM } from './geo-look-angles';
export { BOLTZMANN_DB, MINUTES_PER_MONTH, MINUTES_PER_YEAR, SPEED_OF_LIGHT_M_S } from './physical-constants';

export type { RainCoefficients, RainCoefficientsOptions } from './p838-rain-coefficients';
export type { RainSpecificAttenuationOptions } from './p838-specific-attenuation';
export type { RainAttenuationOptions } from './p618-rain-attenuation';
export type { RainExceedanceOptions } from './p618-rain-exceedance';
export type { ExceedanceBound, RainExceedance, RainPath, RainPathOptions } from './p618-rain-path';
export type { MonthlyRainClimate, MonthlyRainClimateOptions } from './p837-7-monthly-climate';
export type { ScintillationFadeOptions } from './p618-scintillation';
export type { GeoLookAngles, GeoLookAnglesOptions } from './geo-look-angles';
export type { ClimateZone } from './p837-1-climate-zones';
export type { AttenuationComponents, AtmosphericPath, TotalAttenuationCurve } from './p618-total-attenuation';
export type { AtmosphereAtP, AtmosphereLevel, SiteAtmosphere } from './site-atmosphere';
export type { MeasuredRainCurve, MeasuredRainPoint } from './measured-rain-curve';
export type { ClimateSource, ClimateSourceKind, RainClimateInput, RainHeightInput } from './rain-climate-source';
export type { RainHeight, RainHeightSource } from './p839-rain-height';
export type { Modcod } from './dvb-s2-modcods';
export type { AcmShare, AcmThroughput } from './acm-throughput';
export type { OutageFigures } from './outage-figures';
export type { LinkBudget, LinkBudgetOptions } from './link-budget';
export type { SystemNoiseOptions } from './system-noise';
export type {
  AcmModcodInput,
  EngineWarning,
  EngineWarningCode,
  MoneyInput,
  ScintillationLayer,
  TradeoffDishInput,
  TradeoffDownlinkInput,
  TradeoffOption,
  TradeoffReceiverInput,
  TradeoffRecommendation,
  TradeoffResult,
  TradeoffScenario,
  TradeoffUplinkInput,
  TwoWayOutage,
  UplinkOption,
} from './tradeoff-types';
