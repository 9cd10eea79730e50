import { SolverNumericError } from './brent';

/**
 * Root of a monotone decreasing g on [lower, upper] (g(lower) ≥ 0 ≥ g(upper)) by Newton's method
 * kept inside a shrinking bracket: a step that leaves the bracket, or a non-negative slope, falls
 * back to bisection, so it converges like bisection at worst and quadratically near the root.
 * Used where the derivative is cheap next to g (P.837-7 Annex 1: the log-normal density beside
 * its tail), which halves the evaluations of Brent's method.
 *
 * Bad input: a non-finite g or slope throws SolverNumericError; a bracket without a sign change
 * throws Error (an engine defect).
 *
 * @example
 * newtonInBracket((x) => 2 - x * x, (x) => -2 * x, 0, 2) // => 1.4142135623730951
 */
export function newtonInBracket(g: (x: number) => number, slope: (x: number) => number, lower: number, upper: number, tolerance = 1e-12): number {
  let lo = lower;
  let hi = upper;
  const glo = finite(g(lo), lo);
  const ghi = finite(g(hi), hi);
  if (glo === 0) return lo;
  if (ghi === 0) return hi;
  if (glo < 0 || ghi > 0) throw new Error(`newtonInBracket: root not bracketed in [${lower}, ${upper}]`);
  let x = 0.5 * (lo + hi);
  for (let i = 0; i < 200; i++) {
    const gx = finite(g(x), x);
    if (gx === 0) return x;
    if (gx > 0) lo = x;
    else hi = x;
    const d = finite(slope(x), x);
    let next = d < 0 ? x - gx / d : Number.NaN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= tolerance * Math.max(1, Math.abs(x)) || hi - lo <= tolerance) return next;
    x = next;
  }
  return x;
}

function finite(v: number, x: number): number {
  if (!Number.isFinite(v)) throw new SolverNumericError('newtonInBracket', x, v);
  return v;
}
