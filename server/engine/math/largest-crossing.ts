import { brentRoot, SolverNumericError } from './brent';

/** Grid points over the interval: fine enough that a step-10 bump (a fraction of a decade wide) spans several. */
const SCAN_POINTS = 48;
/** Golden-section steps when the peak lies between grid points (shrinks the bracket by 0.618^40 ≈ 4e-9). */
const PEAK_REFINE_STEPS = 40;
/** Probe just inside the lower end: tells a curve that starts by rising (a bump) from one that only falls. */
const START_PROBE_SHARE = 1e-3;

/** Where a curve reaches a level: the largest x with g(x) ≥ level, or why there is none. */
export type Crossing =
  | { kind: 'at'; x: number }
  /** g < level everywhere on the interval (the level is never reached). */
  | { kind: 'never' }
  /** g ≥ level already at the upper end. */
  | { kind: 'everywhere' };

/** A curve sampled once, so that many levels can be looked up on it without resampling. */
export interface SampledCurve {
  /** The scan grid, shared between curves on the same interval. */
  readonly xs: readonly number[];
  readonly gs: readonly number[];
  /** Largest value of g on the interval (refined between grid points), and where it is. */
  readonly peak: number;
  readonly peakX: number;
  /** Largest x in [lower, upper] with g(x) ≥ level. */
  largestReaching(level: number): Crossing;
}

/**
 * Sample g on [lower, upper] for {@link SampledCurve.largestReaching}: the largest x whose value
 * reaches a level. This is the honest inverse of a curve that is not monotone — the attenuation
 * exceeded for p % of the time, A(p), falls with p almost everywhere, but ITU-R P.618-14 step 10
 * can make it rise again just above p = 0.001 % at low latitudes with heavy rain; the exceedance
 * of a level A is then the LARGEST p with A(p) ≥ A, never "below the range" while such a p exists.
 *
 * Method: scan a grid from the upper end down to the first grid point at or above the level,
 * then Brent between it and its upper neighbour (where g is below the level). When no grid point
 * reaches the level but the peak does (a narrow peak between grid points), the peak is refined
 * by golden section and Brent runs between the peak and its upper neighbour.
 *
 * Bad input: a non-finite g anywhere throws SolverNumericError; lower ≥ upper throws Error.
 *
 * @example
 * sampleCurve((x) => -((x - 1) ** 2), 0, 3).largestReaching(-0.25) // => { kind: 'at', x: 1.5 }
 */
export function sampleCurve(g: (x: number) => number, lower: number, upper: number, atGridPoint?: (i: number) => number): SampledCurve {
  if (!(lower < upper)) throw new Error(`sampleCurve: empty interval [${lower}, ${upper}]`);
  const xs = scanGrid(lower, upper);
  // Plain arrays, not Float64Array: a typed array per curve costs the garbage collector an
  // ArrayBuffer to sweep, and a campaign makes one curve per dish (measured: --trace-gc-nvp).
  const gs: number[] = [];
  let arg = 0;
  for (let i = 0; i < SCAN_POINTS; i++) {
    const x = xs[i];
    const v = atGridPoint ? atGridPoint(i) : g(x);
    if (!Number.isFinite(v)) throw new SolverNumericError('sampleCurve', x, v);
    gs.push(v);
    if (v > gs[arg]) arg = i;
  }
  // A curve whose largest grid value is at the lower end and that falls right away has its peak
  // there: no refinement needed (the common, monotone case).
  const monotoneStart = arg === 0 && g(lower + START_PROBE_SHARE * (xs[1] - lower)) <= gs[0];
  const peakAt = monotoneStart ? { x: lower, value: gs[0] } : refinePeak(g, xs, gs, arg);

  const largestReaching = (level: number): Crossing => {
    const last = SCAN_POINTS - 1;
    if (gs[last] >= level) return { kind: 'everywhere' };
    for (let i = last - 1; i >= 0; i--) {
      if (gs[i] < level) continue;
      // A peak narrower than the grid above this point would hold a larger crossing.
      if (peakAt.x > xs[i + 1] && peakAt.value >= level) break;
      // A peak inside this step: the largest crossing lies between it and the upper grid point.
      const from = peakAt.x > xs[i] && peakAt.x < xs[i + 1] && peakAt.value >= level ? peakAt.x : xs[i];
      return { kind: 'at', x: crossing(g, level, from, xs[i + 1]) };
    }
    if (peakAt.value < level) return { kind: 'never' };
    // The level is reached only inside a peak narrower than the grid.
    const above = xs.findIndex((x) => x > peakAt.x);
    return { kind: 'at', x: crossing(g, level, peakAt.x, xs[above]) };
  };
  return { xs, gs, peak: peakAt.value, peakX: peakAt.x, largestReaching };
}

/**
 * The x's sampleCurve scans on [lower, upper]. A caller that evaluates g on many curves sharing
 * part of their arithmetic (the dishes of one site) computes that part once on these points and
 * hands sampleCurve `atGridPoint` — which must equal g(grid[i]) exactly.
 */
export function scanGrid(lower: number, upper: number): readonly number[] {
  // The engine scans a handful of fixed intervals; each grid is made once and shared (read only).
  const hit = grids.find((g) => g.lower === lower && g.upper === upper);
  if (hit) return hit.xs;
  const xs: number[] = [];
  for (let i = 0; i < SCAN_POINTS; i++) xs.push(i === SCAN_POINTS - 1 ? upper : lower + ((upper - lower) * i) / (SCAN_POINTS - 1));
  Object.freeze(xs);
  if (grids.length >= MAX_SHARED_GRIDS) grids.shift();
  grids.push({ lower, upper, xs });
  return xs;
}
const MAX_SHARED_GRIDS = 8;
const grids: { lower: number; upper: number; xs: readonly number[] }[] = [];

function crossing(g: (x: number) => number, level: number, from: number, to: number): number {
  return brentRoot((x) => g(x) - level, from, to, 1e-12 * Math.max(1, Math.abs(from)));
}

/** Golden-section search for the maximum around grid point `arg` (between its neighbours). */
function refinePeak(g: (x: number) => number, xs: readonly number[], gs: readonly number[], arg: number): { x: number; value: number } {
  let a = xs[Math.max(0, arg - 1)];
  let b = xs[Math.min(xs.length - 1, arg + 1)];
  const r = (Math.sqrt(5) - 1) / 2;
  let c = b - r * (b - a);
  let d = a + r * (b - a);
  let gc = g(c);
  let gd = g(d);
  for (let i = 0; i < PEAK_REFINE_STEPS; i++) {
    if (gc > gd) {
      b = d;
      d = c;
      gd = gc;
      c = b - r * (b - a);
      gc = g(c);
    } else {
      a = c;
      c = d;
      gc = gd;
      d = a + r * (b - a);
      gd = g(d);
    }
  }
  const best = gc > gd ? { x: c, value: gc } : { x: d, value: gd };
  if (!Number.isFinite(best.value)) throw new SolverNumericError('sampleCurve peak', best.x, best.value);
  return best.value >= gs[arg] ? best : { x: xs[arg], value: gs[arg] };
}
