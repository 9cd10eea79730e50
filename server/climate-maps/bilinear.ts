import { gridPosition, type Grid } from './grid';
import type { MapEntry } from './map-catalogue';

/**
 * The four grid points around a site and the site's place between them: `index` is the
 * upper-left point (row i, column j) in the row-major array, `cols` the row length, `fy` and
 * `fx` the fractions towards row i + 1 and column j + 1.
 */
export interface BilinearCell {
  index: number;
  cols: number;
  fy: number;
  fx: number;
}

/**
 * The cell of (lat, lon) on a grid. Maps of one geometry share it, so a site's 12 monthly maps
 * cost one cell and 12 weighted sums.
 *
 * @example
 * const cell = bilinearCell(mapEntry('p453-14-nwet-median.f32.gz'), 51.5, -0.14)
 */
export function bilinearCell(entry: MapEntry, latDeg: number, lonDeg: number): BilinearCell {
  const { y, x } = gridPosition(entry, latDeg, lonDeg);
  // The last row or column is only ever the far side of a cell (a site at 90° sits on it with fraction 1).
  const i = Math.min(Math.floor(y), entry.rows - 2);
  const j = Math.min(Math.floor(x), entry.cols - 2);
  return { index: i * entry.cols + j, cols: entry.cols, fy: y - i, fx: x - j };
}

/**
 * Bilinear interpolation (Rec. ITU-R P.1144 Annex 1) of a grid's values in a cell. NaN in any
 * of the four points gives NaN, which callers turn into a refusal.
 *
 * @example
 * bilinearInCell(loadGrid('p453-14-nwet-median.f32.gz').values, cell) // => 50.389… (London)
 */
export function bilinearInCell(values: Float32Array, cell: BilinearCell): number {
  const { index, cols, fy, fx } = cell;
  const top = values[index] + fx * (values[index + 1] - values[index]);
  const bottom = values[index + cols] + fx * (values[index + cols + 1] - values[index + cols]);
  return top + fy * (bottom - top);
}

/**
 * Bilinear value of a grid at (lat, lon).
 *
 * @example
 * bilinearAt(loadGrid('p839-4-isotherm-height.f32.gz'), 51.5, -0.14) // => 2.0927… km
 */
export function bilinearAt(grid: Grid, latDeg: number, lonDeg: number): number {
  return bilinearInCell(grid.values, bilinearCell(grid.entry, latDeg, lonDeg));
}
