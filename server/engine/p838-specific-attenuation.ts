import { PHYSICAL_RANGES } from './physical-ranges';
import { rainCoefficients, type RainCoefficientsOptions } from './p838-rain-coefficients';
import { requireNumberInRange } from './validate';

/** Options of {@link rainSpecificAttenuation}. */
export interface RainSpecificAttenuationOptions extends RainCoefficientsOptions {
  /** Rain rate R, mm/h (≥ 0). */
  rainRateMmH: number;
}

/**
 * Specific attenuation of rain γ_R = k R^α, dB/km (ITU-R P.838-3 eq. (1)), with k and α from
 * {@link rainCoefficients}.
 *
 * Bad input: as rainCoefficients, plus a negative or non-finite rain rate, throws
 * EngineInputError naming the field. R = 0 gives 0 dB/km.
 *
 * @example
 * rainSpecificAttenuation({ frequencyGHz: 14.25, elevationDeg: 31.07699124, tiltDeg: 0, rainRateMmH: 26.48052 })
 * // => 1.58130839… (ITU-R SG 3 validation example)
 */
export function rainSpecificAttenuation(options: RainSpecificAttenuationOptions): number {
  const { k, alpha } = rainCoefficients(options);
  const r = requireNumberInRange(options.rainRateMmH, 'rainRateMmH', 0, PHYSICAL_RANGES.measuredRainRateMmH.max, 'physical range');
  return r === 0 ? 0 : k * r ** alpha;
}
