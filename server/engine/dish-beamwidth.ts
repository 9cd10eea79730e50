import { PHYSICAL_RANGES } from './physical-ranges';
import { SPEED_OF_LIGHT_M_S } from './physical-constants';
import { requireNumberInRange } from './validate';

/** Half-power beamwidth factor, degrees per (λ/D) (server/engine/README.md §3: ≈ 70 λ/D; common practice, no source). */
export const BEAMWIDTH_FACTOR_DEG = 70;

/**
 * Half-power (−3 dB) beamwidth of a circular reflector, degrees: θ_3dB ≈ 70 λ/D
 * (common practice, no source; server/engine/README.md §3).
 *
 * Bad input: D ≤ 0, frequency outside 0.1–1000 GHz or NaN throws EngineInputError.
 *
 * @example
 * dishBeamwidth({ diameterM: 1.2, frequencyGHz: 12 }) // => 1.457… degrees
 */
export function dishBeamwidth(options: { diameterM: number; frequencyGHz: number }): number {
  const d = requireNumberInRange(options.diameterM, 'diameterM', PHYSICAL_RANGES.diameterM.min, PHYSICAL_RANGES.diameterM.max, 'physical range');
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 0.1, 1000);
  return dishBeamwidthUnchecked(d, f);
}

/** {@link dishBeamwidth} without validation (hot path). */
export function dishBeamwidthUnchecked(diameterM: number, frequencyGHz: number): number {
  return (BEAMWIDTH_FACTOR_DEG * (SPEED_OF_LIGHT_M_S / (frequencyGHz * 1e9))) / diameterM;
}
