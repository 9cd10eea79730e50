import { SPEED_OF_LIGHT_M_S } from './physical-constants';
import { requireNumberInRange, requirePositive } from './validate';

/**
 * Free-space path loss, dB: L_fs = 20 log10(4π d f / c) (server/engine/README.md §4; ITU-R P.525).
 *
 * Bad input: distance ≤ 0, frequency outside 0.1–1000 GHz or NaN throws EngineInputError.
 *
 * @example
 * freeSpaceLoss({ rangeKm: 38000, frequencyGHz: 12 }) // => 205.627… dB
 */
export function freeSpaceLoss(options: { rangeKm: number; frequencyGHz: number }): number {
  const d = requirePositive(options.rangeKm, 'rangeKm');
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 0.1, 1000);
  return freeSpaceLossUnchecked(d, f);
}

/** {@link freeSpaceLoss} without validation (hot path). */
export function freeSpaceLossUnchecked(rangeKm: number, frequencyGHz: number): number {
  return 20 * Math.log10((4 * Math.PI * rangeKm * 1e3 * frequencyGHz * 1e9) / SPEED_OF_LIGHT_M_S);
}
