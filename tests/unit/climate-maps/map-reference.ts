import { expect } from 'vitest';
import { expectRelative, REFERENCE_RELATIVE_TOLERANCE } from '../engine/reference-csv';

/**
 * A published figure of 0 cannot be met at a relative tolerance, and the ITU-R check files print
 * their figures to a fixed number of decimals (8 for heights and rain rates), so a 0 there only
 * says the true value rounds to 0. 1e-6 absolute is far inside what any use of these quantities
 * can notice (a micrometre of height, a micro-mm/h of rain) yet fails any real departure.
 */
export const ZERO_ABSOLUTE_TOLERANCE = 1e-6;

/**
 * |actual/expected − 1| ≤ 1e-4, or |actual| ≤ 1e-6 where the published figure is 0.
 *
 * @example
 * expectReference(c.rainHeightKm, 2.45273333, 'V8 hR') // ITU-R SG 3 validation example
 */
export function expectReference(actual: number, expected: number, label: string): void {
  if (expected === 0) {
    expect(Number.isFinite(actual), `${label} is finite`).toBe(true);
    expect(Math.abs(actual), `${label}: got ${actual}, expected 0`).toBeLessThanOrEqual(ZERO_ABSOLUTE_TOLERANCE);
    return;
  }
  expectRelative(actual, expected, REFERENCE_RELATIVE_TOLERANCE, label);
}
