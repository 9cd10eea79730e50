import { bilinearInCell, type BilinearCell } from './bilinear';
import { loadGrid, requireSameGeometry, type Grid } from './grid';
import { mapFileFor } from './map-catalogue';
import { betweenTabulated, logPBracket, TABULATED_P_PERCENT } from './log-p-interpolation';
import { vapourCell, vapourLevel } from './p836-6-water-vapour';
import { checkCoordinates, mapValueOrRefuse, type SiteCoordinates } from './site-input';

const cloudGrids: (Grid | undefined)[] = new Array(TABULATED_P_PERCENT.length);

/**
 * The P.840-8 reduced cloud liquid map of tabulated p number `k` (0 = 0.1 %), loaded on first use.
 *
 * @example
 * cloudLiquidGrid(4).entry.pPercent // => 1
 */
export function cloudLiquidGrid(k: number): Grid {
  const known = cloudGrids[k];
  if (known) return known;
  const grid = loadGrid(mapFileFor('p840-8-reduced-cloud-liquid-', { pPercent: TABULATED_P_PERCENT[k] }));
  // Sites are placed on it with the P.836-6 cell, so the two grids must coincide.
  requireSameGeometry([vapourLevel(0).content, grid]);
  return (cloudGrids[k] = grid);
}

/**
 * L_red of tabulated p number `k` in a P.836-6/P.840-8 cell, kg/m² (NaN where the map is blank).
 *
 * @example
 * cloudLiquidAtLevel(4, vapourCell(51.5, -0.14)) // => 1.2632… (ITU-R SG 3 validation example: 1.26328615)
 */
export function cloudLiquidAtLevel(k: number, cell: BilinearCell): number {
  return bilinearInCell(cloudLiquidGrid(k).values, cell);
}

/** Input of {@link reducedCloudLiquidAt}. */
export interface ReducedCloudLiquidOptions extends SiteCoordinates {
  /** Percentage of the year, 0.1…99 %. */
  pPercent: number;
}

/**
 * Reduced total columnar cloud liquid water content L_red(p), kg/m² (Rec. ITU-R P.840-8 digital
 * maps): bilinear on the maps of the two tabulated p around p, then linear in ln p. p outside
 * 0.1…99 % or a site where the maps are blank (above 87.75° N) throws EngineInputError.
 *
 * @example
 * reducedCloudLiquidAt({ latDeg: 51.5, lonDeg: -0.14, pPercent: 0.15 }) // => 1.80380… (ITU-R SG 3 validation example)
 */
export function reducedCloudLiquidAt(options: ReducedCloudLiquidOptions): number {
  checkCoordinates(options);
  const bracket = logPBracket(options.pPercent);
  const cell = vapourCell(options.latDeg, options.lonDeg);
  const lower = cloudLiquidAtLevel(bracket.lower, cell);
  const upper = bracket.t === 0 ? lower : cloudLiquidAtLevel(bracket.upper, cell);
  return mapValueOrRefuse(betweenTabulated(bracket, lower, upper), cloudLiquidGrid(bracket.lower).entry, options);
}
