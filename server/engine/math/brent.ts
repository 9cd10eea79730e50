/**
 * Brent's root finder (R. P. Brent, "Algorithms for Minimization without Derivatives", 1973,
 * ch. 4): bisection's guarantee with inverse-quadratic speed. The engine uses it for every
 * monotone inverse (ITU-R P.618 exceedance on ln p, ITU-R P.837-7 R_p on ln R).
 *
 * Bad input: the caller must pass a bracket with f(a)·f(b) ≤ 0; if not, this throws a plain
 * Error (an engine bug, not a user error). A function value that is not a finite number (NaN,
 * ±Infinity) anywhere in the iteration throws {@link SolverNumericError}: NaN compares false
 * with everything, so without this check it would steer the bracket silently and come out as a
 * plausible-looking end of the interval.
 *
 * @example
 * brentRoot((x) => x * x - 2, 0, 2, 1e-14) // => 1.4142135623730951 (to 1e-14)
 */
/** A solver met a value that is not a finite number: an engine defect, never a result. */
export class SolverNumericError extends Error {
  constructor(where: string, x: number, fx: number) {
    super(`${where}: the function is not a finite number at ${x} (got ${fx}); no result is given`);
    this.name = 'SolverNumericError';
  }
}

/** f(x), refusing anything but a finite number. */
function finiteAt(f: (x: number) => number, x: number): number {
  const v = f(x);
  if (!Number.isFinite(v)) throw new SolverNumericError('brentRoot', x, v);
  return v;
}

export function brentRoot(
  f: (x: number) => number,
  lower: number,
  upper: number,
  absoluteTolerance: number,
  maxIterations = 200,
): number {
  let a = lower;
  let b = upper;
  if (!Number.isFinite(lower) || !Number.isFinite(upper)) throw new SolverNumericError('brentRoot bracket', lower, upper);
  let fa = finiteAt(f, a);
  let fb = finiteAt(f, b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new Error(`brentRoot: root not bracketed in [${lower}, ${upper}]`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * absoluteTolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = finiteAt(f, b);
  }
  return b;
}
