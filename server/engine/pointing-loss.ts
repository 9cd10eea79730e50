import { requireNonNegative, requirePositive } from './validate';

/** Pointing loss coefficient, dB (12 (θ_e/θ_3dB)²; common practice, no source). */
export const POINTING_LOSS_COEFFICIENT_DB = 12;

/**
 * Gain lost to a pointing error θ_e, dB: L = 12 (θ_e/θ_3dB)² (common practice, no source;
 * server/engine/README.md §3). Good to about one beamwidth; beyond that the main-lobe model does not hold.
 *
 * Bad input: negative error, beamwidth ≤ 0 or NaN throws EngineInputError naming the field.
 *
 * @example
 * pointingLoss({ pointingErrorDeg: 0.2, beamwidthDeg: 1.457 }) // => 0.226… dB
 */
export function pointingLoss(options: { pointingErrorDeg: number; beamwidthDeg: number }): number {
  const e = requireNonNegative(options.pointingErrorDeg, 'pointingErrorDeg');
  const bw = requirePositive(options.beamwidthDeg, 'beamwidthDeg');
  return pointingLossUnchecked(e, bw);
}

/** {@link pointingLoss} without validation (hot path). */
export function pointingLossUnchecked(pointingErrorDeg: number, beamwidthDeg: number): number {
  const r = pointingErrorDeg / beamwidthDeg;
  return POINTING_LOSS_COEFFICIENT_DB * r * r;
}
