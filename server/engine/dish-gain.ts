import { PHYSICAL_RANGES } from './physical-ranges';
import { SPEED_OF_LIGHT_M_S } from './physical-constants';
import { EngineInputError } from './errors';
import { requireNumberInRange, requirePositive } from './validate';

/**
 * Boresight gain of a circular reflector, dBi: G = 10 log10(η (π D f / c)²) (server/engine/README.md §3;
 * the standard aperture-antenna formula).
 *
 * Bad input: D ≤ 0 (a negative diameter included), η outside (0, 1], frequency outside
 * 0.1–1000 GHz or NaN throws EngineInputError naming the field.
 *
 * @example
 * dishGain({ diameterM: 1.2, efficiency: 0.65, frequencyGHz: 12 }) // => 41.70… dBi
 */
export function dishGain(options: { diameterM: number; efficiency: number; frequencyGHz: number }): number {
  const d = requireNumberInRange(options.diameterM, 'diameterM', PHYSICAL_RANGES.diameterM.min, PHYSICAL_RANGES.diameterM.max, 'physical range');
  const eta = requirePositive(options.efficiency, 'efficiency');
  if (eta > 1) throw new EngineInputError('efficiency', `must be at most 1; got ${eta}`, eta);
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 0.1, 1000);
  return dishGainUnchecked(d, eta, f);
}

/** {@link dishGain} without validation (hot path). */
export function dishGainUnchecked(diameterM: number, efficiency: number, frequencyGHz: number): number {
  const x = (Math.PI * diameterM * frequencyGHz * 1e9) / SPEED_OF_LIGHT_M_S;
  return 10 * Math.log10(efficiency * x * x);
}
