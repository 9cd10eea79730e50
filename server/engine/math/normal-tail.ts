import { scaledErfcChebyshev } from './scaled-erfc-chebyshev';
/**
 * Complementary error function and the standard-normal tail Q(z), to about 1e-14 relative —
 * JavaScript has no Math.erfc, and ITU-R P.837-7 Annex 1 step 4 needs Q(z) deep in the tail.
 *
 * Method (textbook, no ITU source): for |x| < 1.2 the everywhere-positive series
 * erf x = (2/√π) e^{−x²} Σ 2ⁿ x^{2n+1} / (1·3·…·(2n+1)), then erfc = 1 − erf; for x ≥ 1.2 the
 * Laplace continued fraction erfc x = (e^{−x²}/√π) · 1/(x + ½/(x + 1/(x + (3/2)/(x + …)))),
 * evaluated by the modified Lentz algorithm — read through Chebyshev tables of e^{x²} erfc x
 * built from it once (scaled-erfc-chebyshev.ts), which are ~10× faster. erfc(−x) = 2 − erfc(x).
 *
 * Bad input: NaN in, NaN out is not allowed in the engine, so callers validate first; this
 * internal helper only ever sees finite numbers.
 *
 * @example
 * erfc(1) // => 0.15729920705028513
 * normalTail(0) // => 0.5
 */
export function erfc(x: number): number {
  if (x < 0) return 2 - erfc(-x);
  if (x === 0) return 1;
  if (x > 27) return 0; // e^{-729} underflows a double
  return scaledErfcChebyshev(x, exactScaledErfc) * Math.exp(-x * x);
}

/** e^{x²} erfc(x) from the series (x < 1.2) or the continued fraction: the source of the tables. */
export function exactScaledErfc(x: number): number {
  return x < SERIES_LIMIT ? (1 - erfSeries(x)) * Math.exp(x * x) : scaledErfcContinuedFraction(x);
}



/** Q(z) = P(Z > z) for a standard normal Z = ½ erfc(z/√2). */
export function normalTail(z: number): number {
  return 0.5 * erfc(z * Math.SQRT1_2);
}

/** Switch point between series and continued fraction (both are accurate to ~1e-15 here). */
const SERIES_LIMIT = 1.2;
const TWO_OVER_SQRT_PI = 1.1283791670955126;
const ONE_OVER_SQRT_PI = 0.5641895835477563;

/** Series part, exported for the overlap test only. */
export function erfSeries(x: number): number {
  const x2 = x * x;
  let term = x;
  let sum = x;
  for (let n = 0; n < 200; n++) {
    term *= (2 * x2) / (2 * n + 3);
    sum += term;
    if (term < sum * 1e-17) break;
  }
  return TWO_OVER_SQRT_PI * Math.exp(-x2) * sum;
}

/** e^{x²} erfc(x) by the continued fraction (x > 0): the exact source of the fast tables (no overflow of e^{x²}). */
export function scaledErfcContinuedFraction(x: number): number {
  // K = x + (1/2)/(x + 1/(x + (3/2)/(x + 2/(x + ...)))): partial numerators a_n = n/2, denominators x.
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let n = 1; n < 500; n++) {
    const a = n / 2;
    d = x + a * d;
    d = Math.abs(d) < tiny ? tiny : d;
    c = x + a / c;
    c = Math.abs(c) < tiny ? tiny : c;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return ONE_OVER_SQRT_PI / f;
}

/** Continued-fraction part (x > 0), exported for the overlap test only. */
export function erfcContinuedFraction(x: number): number {
  return scaledErfcContinuedFraction(x) * Math.exp(-x * x);
}
