/**
 * Fast scaled complementary error function erfcx(x) = e^{x²} erfc(x) for 0 ≤ x ≤ 27, by
 * Chebyshev interpolation on a few sub-intervals. The coefficients are not typed in: they are
 * computed once, at first use, from the slow but exact continued fraction (`exact`), at the
 * Chebyshev nodes of each interval (the series below 1.2). erfcx is smooth and slowly varying there, so degree 22 is
 * accurate to about 1e-15 relative (a unit test compares it with the continued fraction at
 * thousands of points). Why: P.837-7 Annex 1 sums twelve normal tails per rain-rate guess and
 * every site of a campaign solves for R0.01; the continued fraction needs tens of iterations
 * per call near x ≈ 1.2–3.
 *
 * @example
 * scaledErfcChebyshev(2, exactErfcx) // => 0.2554025250890605 (e^4 erfc 2)
 */
const INTERVALS: readonly (readonly [number, number])[] = [
  [0, 0.6],
  [0.6, 1.2],
  [1.2, 2],
  [2, 3],
  [3, 4.5],
  [4.5, 7],
  [7, 12],
  [12, 27],
];
const DEGREE = 22;

let tables: Float64Array[] | null = null;

function buildTables(exact: (x: number) => number): Float64Array[] {
  return INTERVALS.map(([a, b]) => {
    const n = DEGREE + 1;
    const values = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const t = Math.cos((Math.PI * (k + 0.5)) / n);
      values[k] = exact(0.5 * (a + b) + 0.5 * (b - a) * t);
    }
    const c = new Float64Array(n);
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += values[k] * Math.cos((Math.PI * j * (k + 0.5)) / n);
      c[j] = (2 / n) * s;
    }
    return c;
  });
}

/** erfcx(x) for 0 ≤ x ≤ 27 (`exact` builds the tables on the first call). */
export function scaledErfcChebyshev(x: number, exact: (x: number) => number): number {
  tables ??= buildTables(exact);
  let i = 0;
  while (i < INTERVALS.length - 1 && x > INTERVALS[i][1]) i++;
  // Indexed, not destructured: array destructuring allocates an iterator on every call (P.837 calls this per month per step).
  const a = INTERVALS[i][0];
  const b = INTERVALS[i][1];
  const c = tables[i];
  const t = (2 * x - a - b) / (b - a);
  // Clenshaw recurrence for Σ' c_j T_j(t).
  let b1 = 0;
  let b2 = 0;
  for (let j = c.length - 1; j >= 1; j--) {
    const b0 = 2 * t * b1 - b2 + c[j];
    b2 = b1;
    b1 = b0;
  }
  return t * b1 - b2 + 0.5 * c[0];
}
