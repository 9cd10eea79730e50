import { checkRainPathOptions, MAX_P_PERCENT_P618_14, MIN_P_PERCENT_P618_14, prepareRainPathUnchecked, type RainPathOptions } from './p618-rain-path';
import { requireNumberInRange } from './validate';

/** Options of {@link rainAttenuation}: the path of ITU-R P.618-14 §2.2.1.1 plus p. */
export interface RainAttenuationOptions extends RainPathOptions {
  /** Percentage of an average year, 0.001–5 %. */
  pPercent: number;
}

/**
 * Rain attenuation A_p exceeded for p % of an average year, dB: ITU-R P.618-14 §2.2.1.1
 * steps 1–9 for A_0.01, then step 10 for 0.001 % ≤ p ≤ 5 %.
 *
 * Bad input: p outside 0.001–5 %, frequency outside 1–55 GHz, elevation ≤ 0° (satellite
 * below the horizon) or any NaN throws EngineInputError naming the field. A station above the
 * rain height or R_0.01 = 0 gives 0 dB (step 2 / step 4).
 *
 * @example
 * rainAttenuation({ latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25,
 *   elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333, pPercent: 0.1 })
 * // => 2.185847… (ITU-R SG 3 validation example)
 */
export function rainAttenuation(options: RainAttenuationOptions): number {
  checkRainPathOptions(options);
  const p = requireNumberInRange(
    options.pPercent,
    'pPercent',
    MIN_P_PERCENT_P618_14,
    MAX_P_PERCENT_P618_14,
    'ITU-R P.618-14 step 10 covers 0.001–5 % of an average year',
  );
  return prepareRainPathUnchecked(options).attenuationAt(p);
}
