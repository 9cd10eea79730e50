import { checkRainPathOptions, prepareRainPathUnchecked, type RainExceedance, type RainPathOptions } from './p618-rain-path';
import { requireNonNegative } from './validate';

/** Options of {@link rainExceedance}: the path of ITU-R P.618-14 §2.2.1.1 plus an attenuation. */
export interface RainExceedanceOptions extends RainPathOptions {
  /** Rain attenuation whose exceedance is wanted, dB (≥ 0). */
  attenuationDb: number;
}

/**
 * Inverse of ITU-R P.618-14 §2.2.1.1 step 10: the percentage of an average year p for which
 * the rain attenuation exceeds `attenuationDb`. A_p falls monotonically with p, so the engine
 * solves ln A_p(ln p) = ln A on ln p ∈ [ln 0.001, ln 5] by Brent's method to 1e-12 in ln p,
 * with A_0.01 computed once (steps 1–9), not per iteration.
 *
 * Outside the model range it reports a bound, never a made-up number:
 * A > A_0.001 → `{ pPercent: 0.001, bound: 'below-model-range' }` (p is at most 0.001 %);
 * A < A_5 (including A = 0) → `{ pPercent: 5, bound: 'above-model-range' }` (p is at least 5 %).
 * With no rain fade at all (A_0.01 = 0) every A ≥ 0 is 'below-model-range'.
 *
 * Bad input: negative or NaN attenuation and the path rules of rainAttenuation throw
 * EngineInputError naming the field.
 *
 * @example
 * rainExceedance({ latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25,
 *   elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333,
 *   attenuationDb: 2.185847422 })
 * // => { pPercent: 0.1000000…, bound: 'none' }
 */
export function rainExceedance(options: RainExceedanceOptions): RainExceedance {
  checkRainPathOptions(options);
  const a = requireNonNegative(options.attenuationDb, 'attenuationDb');
  return prepareRainPathUnchecked(options).exceedanceOf(a);
}
