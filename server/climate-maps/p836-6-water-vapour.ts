import { bicubicP1144At } from './bicubic-p1144';
import { bilinearCell, type BilinearCell } from './bilinear';
import { loadGrid, requireSameGeometry, type Grid } from './grid';
import { mapFileFor } from './map-catalogue';
import { betweenTabulated, logPBracket, TABULATED_P_PERCENT } from './log-p-interpolation';
import { checkCoordinates, checkStationHeight, mapValueOrRefuse, type SiteCoordinates } from './site-input';

/** Surface water vapour density ρ and total columnar water vapour content V exceeded p % of the year. */
export interface WaterVapour {
  /** ρ, g/m³, at the station height. */
  surfaceVapourDensityGM3: number;
  /** V, kg/m², above the station height. */
  waterVapourContentKgM2: number;
}

interface VapourLevel {
  density: Grid;
  content: Grid;
  scaleHeight: Grid;
}

const P1511_FILE = 'p1511-1-topographic-height.f32.gz';
/** P.1511-1 reads its map with longitude in [0, 360) (see the maps README). */
const P1511_LON_START_DEG = 0;

const levels: (VapourLevel | undefined)[] = new Array(TABULATED_P_PERCENT.length);
let pointHeights: Float64Array | null = null;

/**
 * The three P.836-6 maps of tabulated p number `k` (0 = 0.1 %), loaded on first use.
 *
 * @example
 * vapourLevel(0).scaleHeight.entry.file // => 'p836-6-vapour-scale-height-p01.f32.gz'
 */
export function vapourLevel(k: number): VapourLevel {
  const known = levels[k];
  if (known) return known;
  const pPercent = TABULATED_P_PERCENT[k];
  const level: VapourLevel = {
    density: loadGrid(mapFileFor('p836-6-surface-vapour-density-', { pPercent })),
    content: loadGrid(mapFileFor('p836-6-water-vapour-content-', { pPercent })),
    scaleHeight: loadGrid(mapFileFor('p836-6-vapour-scale-height-', { pPercent })),
  };
  // Every level is read through one cell and one table of grid-point heights.
  requireSameGeometry([level.density, level.content, level.scaleHeight, ...(levels[0] ? [levels[0].content] : [])]);
  return (levels[k] = level);
}

/**
 * The P.1511-1 topographic height (P.1144 bicubic) at every P.836-6 grid point, computed once:
 * the altitude each map value belongs to before it is scaled to the station.
 *
 * @example
 * vapourGridPointHeightsKm().length // => 161 * 321
 */
export function vapourGridPointHeightsKm(): Float64Array {
  if (pointHeights) return pointHeights;
  const { entry } = vapourLevel(0).content;
  const topography = loadGrid(P1511_FILE);
  const heights = new Float64Array(entry.rows * entry.cols);
  for (let i = 0; i < entry.rows; i++) {
    const lat = entry.firstLatDeg + i * entry.latStepDeg;
    for (let j = 0; j < entry.cols; j++) {
      heights[i * entry.cols + j] = bicubicP1144At(topography, lat, entry.firstLonDeg + j * entry.lonStepDeg, P1511_LON_START_DEG);
    }
  }
  return (pointHeights = heights);
}

/**
 * The cell of a site on the P.836-6 grid (shared with P.840-8).
 *
 * @example
 * vapourCell(51.5, -0.14).cols // => 321
 */
export function vapourCell(latDeg: number, lonDeg: number): BilinearCell {
  return bilinearCell(vapourLevel(0).content.entry, latDeg, lonDeg);
}

/**
 * ρ and V of tabulated p number `k` at the station height (Rec. ITU-R P.836-6): each of the four
 * grid points' values × exp(−(h − h_point)/vsch_point), then bilinear. NaN where a map is blank.
 *
 * @example
 * vapourAtLevel(0, vapourCell(51.5, -0.14), 0.0314) // => { surfaceVapourDensityGM3: 15.37…, waterVapourContentKgM2: 39.64… }
 */
export function vapourAtLevel(k: number, cell: BilinearCell, stationHeightKm: number): WaterVapour {
  const { density, content, scaleHeight } = vapourLevel(k);
  const heights = vapourGridPointHeightsKm();
  const rho = density.values;
  const v = content.values;
  const vsch = scaleHeight.values;
  const i00 = cell.index;
  const i01 = i00 + 1;
  const i10 = i00 + cell.cols;
  const i11 = i10 + 1;
  const s00 = Math.exp(-(stationHeightKm - heights[i00]) / vsch[i00]);
  const s01 = Math.exp(-(stationHeightKm - heights[i01]) / vsch[i01]);
  const s10 = Math.exp(-(stationHeightKm - heights[i10]) / vsch[i10]);
  const s11 = Math.exp(-(stationHeightKm - heights[i11]) / vsch[i11]);
  const w00 = (1 - cell.fy) * (1 - cell.fx);
  const w01 = (1 - cell.fy) * cell.fx;
  const w10 = cell.fy * (1 - cell.fx);
  const w11 = cell.fy * cell.fx;
  return {
    surfaceVapourDensityGM3: w00 * rho[i00] * s00 + w01 * rho[i01] * s01 + w10 * rho[i10] * s10 + w11 * rho[i11] * s11,
    waterVapourContentKgM2: w00 * v[i00] * s00 + w01 * v[i01] * s01 + w10 * v[i10] * s10 + w11 * v[i11] * s11,
  };
}

/** Input of {@link vapourAt}. */
export interface VapourAtOptions extends SiteCoordinates {
  /** Station height, km above mean sea level (−0.5…9). */
  stationHeightKm: number;
  /** Percentage of the year, 0.1…99 %. */
  pPercent: number;
}

/**
 * Surface water vapour density ρ(p) and total columnar content V(p) at a site and station height
 * (Rec. ITU-R P.836-6 digital maps): altitude-scaled at the four grid points, bilinear, then
 * linear in ln p between the tabulated p. p outside 0.1…99 %, a station height outside −0.5…9 km,
 * or a site where the maps are blank (above 87.75° N) throws EngineInputError.
 *
 * @example
 * vapourAt({ latDeg: 51.5, lonDeg: -0.14, stationHeightKm: 0.03138298, pPercent: 0.15 })
 * // => { surfaceVapourDensityGM3: 15.1777…, waterVapourContentKgM2: 38.8244… } (ITU-R SG 3 validation example)
 */
export function vapourAt(options: VapourAtOptions): WaterVapour {
  checkCoordinates(options);
  const h = checkStationHeight(options.stationHeightKm);
  const bracket = logPBracket(options.pPercent);
  const cell = vapourCell(options.latDeg, options.lonDeg);
  const lower = vapourAtLevel(bracket.lower, cell, h);
  const upper = bracket.t === 0 ? lower : vapourAtLevel(bracket.upper, cell, h);
  const level = vapourLevel(bracket.lower);
  return {
    surfaceVapourDensityGM3: mapValueOrRefuse(
      betweenTabulated(bracket, lower.surfaceVapourDensityGM3, upper.surfaceVapourDensityGM3),
      level.density.entry,
      options,
    ),
    waterVapourContentKgM2: mapValueOrRefuse(betweenTabulated(bracket, lower.waterVapourContentKgM2, upper.waterVapourContentKgM2), level.content.entry, options),
  };
}
