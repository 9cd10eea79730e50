/** The benchmark's invented sites (bench data) and catalogue sizes, shared by the campaign benchmarks. */
export const BENCH_DISH_DIAMETERS_M = [0.45, 0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8];

/** One CSV line of invented site i: a spread over a mid-latitude box; every fifth has no altitude. */
export function benchSiteLine(i: number): string {
  return `B${i},${(38 + (i % 170) / 10).toFixed(3)},${(-6 + (i % 131) / 10).toFixed(3)},${i % 5 === 4 ? '' : (i * 7) % 900},${[45, 60, 75, 90][i % 4]}`;
}
