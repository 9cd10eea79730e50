import { gridPosition, type Grid } from './grid';

/** Keys kernel parameter a of Rec. ITU-R P.1144 Annex 1 bicubic interpolation. */
const KEYS_A = -0.5;

/**
 * The P.1144 bicubic (Keys) weight of a grid point at distance `t` (in grid steps) from the site.
 *
 * @example
 * keysWeight(0) // => 1
 * keysWeight(1) // => 0
 * keysWeight(1.5) // => -0.0625
 */
export function keysWeight(t: number): number {
  const d = Math.abs(t);
  if (d <= 1) return ((KEYS_A + 2) * d - (KEYS_A + 3)) * d * d + 1;
  if (d < 2) return KEYS_A * (((d - 5) * d + 8) * d - 4);
  return 0;
}

/**
 * Bicubic interpolation of Rec. ITU-R P.1144 Annex 1 (Keys kernel, a = −0.5) over the 4 × 4 grid
 * points around (lat, lon), with longitude taken in [lonStartDeg, lonStartDeg + 360). P.1511-1
 * takes longitude in [0, 360), which with its half-step padding keeps all 16 points inside the grid.
 *
 * @example
 * bicubicP1144At(loadGrid('p1511-1-topographic-height.f32.gz'), 51.5, -0.14, 0) // => 0.069164… km
 */
export function bicubicP1144At(grid: Grid, latDeg: number, lonDeg: number, lonStartDeg: number): number {
  const { entry, values } = grid;
  const { y, x } = gridPosition(entry, latDeg, lonDeg, lonStartDeg);
  const i = Math.floor(y);
  const j = Math.floor(x);
  const dy = y - i;
  const dx = x - j;
  let sum = 0;
  for (let m = -1; m <= 2; m++) {
    const wy = keysWeight(dy - m);
    // Outside the grid only where the site sits exactly on the last row, and there the weight is 0.
    if (wy === 0) continue;
    const row = Math.min(Math.max(i + m, 0), entry.rows - 1) * entry.cols;
    let rowSum = 0;
    for (let n = -1; n <= 2; n++) {
      const wx = keysWeight(dx - n);
      if (wx === 0) continue;
      rowSum += wx * values[row + Math.min(Math.max(j + n, 0), entry.cols - 1)];
    }
    sum += wy * rowSum;
  }
  return sum;
}
