import { requireNumberInRange } from './validate';

/** Earth radius used by ITU-R P.835-6 to turn geometric into geopotential height, km. */
const GEOPOTENTIAL_RADIUS_KM_P835 = 6356.766;
/** Sea-level pressure of the mean annual global reference atmosphere, hPa (ITU-R P.835-6 §1.1). */
const SEA_LEVEL_PRESSURE_HPA_P835 = 1013.25;
/** Sea-level temperature of the reference atmosphere, K (ITU-R P.835-6 §1.1). */
const SEA_LEVEL_TEMPERATURE_K_P835 = 288.15;
/** Temperature lapse rate of the first layer (0–11 km'), K/km'. */
const LAPSE_RATE_K_KM_P835 = 6.5;
/** g·M/R of the hydrostatic equation, K/km'. */
const HYDROSTATIC_CONSTANT_K_KM_P835 = 34.1632;

/**
 * Pressure of the ITU-R P.835-6 mean annual global reference (standard) atmosphere at a station
 * height h, hPa, for the first layer (0–11 km):
 * h' = 6356.766 h/(6356.766 + h) (geopotential height, km'), then
 * P = 1013.25 (288.15/(288.15 − 6.5 h'))^(−34.1632/6.5).
 *
 * Why geopotential: P.835-6 writes its layers in h'. Using h directly differs by only
 * 4e-8 relative at 50 m, but with h' the ITU-R SG 3 validation examples of P.676-12 (pressure at
 * the station height) are reproduced to 3e-10, which shows they use h' too.
 *
 * Bad input: h outside 0–11 km (or NaN) throws EngineInputError naming `stationHeightKm`.
 *
 * @example
 * standardPressureHpaP835(0.031382984) // => 1009.4856118… (ITU-R SG 3 validation example, P.676-12: 1009.485612)
 */
export function standardPressureHpaP835(stationHeightKm: number): number {
  const h = requireNumberInRange(stationHeightKm, 'stationHeightKm', 0, 11, 'the first layer of the ITU-R P.835-6 reference atmosphere');
  return standardPressureHpaP835Unchecked(h);
}

/** {@link standardPressureHpaP835} without the input check, for hot paths (h already validated). */
export function standardPressureHpaP835Unchecked(stationHeightKm: number): number {
  const hGeo = (GEOPOTENTIAL_RADIUS_KM_P835 * stationHeightKm) / (GEOPOTENTIAL_RADIUS_KM_P835 + stationHeightKm);
  const temperatureK = SEA_LEVEL_TEMPERATURE_K_P835 - LAPSE_RATE_K_KM_P835 * hGeo;
  return SEA_LEVEL_PRESSURE_HPA_P835 * (SEA_LEVEL_TEMPERATURE_K_P835 / temperatureK) ** (-HYDROSTATIC_CONSTANT_K_KM_P835 / LAPSE_RATE_K_KM_P835);
}
