import { PHYSICAL_RANGES } from './physical-ranges';
import { EngineInputError } from './errors';
import { requireFinite } from './validate';

/** One point of a measured rain-rate exceedance curve. */
export interface MeasuredRainPoint {
  /** Percentage of an average year, % (> 0, ≤ 100). */
  pPercent: number;
  /** Rain rate exceeded for that percentage, mm/h (> 0). */
  rainRateMmH: number;
}

/** A checked curve, sorted by falling p, ready for interpolation. */
export interface MeasuredRainCurve {
  /** Points sorted from the largest p to the smallest. */
  points: readonly MeasuredRainPoint[];
  /** Smallest and largest measured p, %. */
  minPPercent: number;
  maxPPercent: number;
  /** True when p lies inside the measured range (ends included). */
  covers(pPercent: number): boolean;
  /** Interpolated R_p (mm/h); throws EngineInputError when p is outside the measured range. */
  rainRateAt(pPercent: number): number;
}

/**
 * Check a measured exceedance curve (e.g. an uploaded CSV of `p_percent, rain_rate_mm_h`) and
 * prepare log-log interpolation: log R linear in log p between neighbouring points (server/engine/README.md §1,
 * source 2). Never extrapolates: asking for p outside [min p, max p] throws, so a curve that
 * stops at 0.03 % cannot silently supply R_0.01.
 *
 * Bad input: fewer than 2 points, p ≤ 0 or > 100, R ≤ 0, NaN, duplicate p, or a rain rate that
 * rises with p (a curve must fall) throws EngineInputError whose field is
 * `${field}[i].pPercent` / `${field}[i].rainRateMmH` (field defaults to `'measuredCurve'`).
 *
 * @example
 * const curve = measuredRainCurve({ points: [{ pPercent: 0.1, rainRateMmH: 10 }, { pPercent: 0.001, rainRateMmH: 100 }] })
 * curve.rainRateAt(0.01) // => 31.62… (geometric midpoint in log-log)
 */
export function measuredRainCurve(options: { points: readonly MeasuredRainPoint[]; field?: string }): MeasuredRainCurve {
  const field = options.field ?? 'measuredCurve';
  const raw = options.points;
  if (!Array.isArray(raw) || raw.length < 2) {
    throw new EngineInputError(field, 'needs at least two points (p %, rain rate mm/h)', raw);
  }
  const indexed = raw.map((pt, i) => {
    const p = requireFinite(pt?.pPercent, `${field}[${i}].pPercent`);
    const r = requireFinite(pt?.rainRateMmH, `${field}[${i}].rainRateMmH`);
    if (p <= 0 || p > 100) throw new EngineInputError(`${field}[${i}].pPercent`, `must be above 0 and at most 100; got ${p}`, p);
    if (r <= 0) throw new EngineInputError(`${field}[${i}].rainRateMmH`, `must be above 0 (log-log interpolation); got ${r}`, r);
    if (r > PHYSICAL_RANGES.measuredRainRateMmH.max) {
      throw new EngineInputError(`${field}[${i}].rainRateMmH`, `must be at most ${PHYSICAL_RANGES.measuredRainRateMmH.max} mm/h (physical range); got ${r}`, r);
    }
    return { i, p, r };
  });
  indexed.sort((a, b) => b.p - a.p);
  for (let j = 1; j < indexed.length; j++) {
    const prev = indexed[j - 1];
    const cur = indexed[j];
    if (cur.p === prev.p) throw new EngineInputError(`${field}[${cur.i}].pPercent`, `duplicate percentage ${cur.p}`, cur.p);
    if (cur.r < prev.r) {
      throw new EngineInputError(
        `${field}[${cur.i}].rainRateMmH`,
        `rain rate must not fall as p gets smaller (${cur.r} mm/h at ${cur.p} % < ${prev.r} mm/h at ${prev.p} %)`,
        cur.r,
      );
    }
  }
  const points = indexed.map(({ p, r }) => ({ pPercent: p, rainRateMmH: r }));
  const maxP = points[0].pPercent;
  const minP = points[points.length - 1].pPercent;
  const covers = (p: number): boolean => p >= minP && p <= maxP;
  const rainRateAt = (pPercent: number): number => {
    const p = requireFinite(pPercent, 'pPercent');
    if (!covers(p)) {
      throw new EngineInputError(
        field,
        `the measured curve covers ${minP}–${maxP} % of the year; ${p} % is outside it and is not extrapolated`,
        p,
      );
    }
    for (let j = 0; j < points.length - 1; j++) {
      const a = points[j];
      const b = points[j + 1];
      if (p === a.pPercent) return a.rainRateMmH;
      if (p === b.pPercent) return b.rainRateMmH;
      if (p > b.pPercent) {
        const t = Math.log(p / a.pPercent) / Math.log(b.pPercent / a.pPercent);
        return Math.exp(Math.log(a.rainRateMmH) + t * Math.log(b.rainRateMmH / a.rainRateMmH));
      }
    }
    return points[points.length - 1].rainRateMmH;
  };
  return { points, minPPercent: minP, maxPPercent: maxP, covers, rainRateAt };
}
