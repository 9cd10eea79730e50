import { PHYSICAL_RANGES } from './physical-ranges';
import { newtonInBracket } from './math/newton-in-bracket';
import { normalTail } from './math/normal-tail';
import { requireFiniteArray, requireNonNegative, requireNumberInRange } from './validate';

/** Options of {@link monthlyRainClimate}. */
export interface MonthlyRainClimateOptions {
  /** Monthly mean total rainfall MT_ii, mm, January…December (12 values ≥ 0). */
  monthlyRainfallMm: readonly number[];
  /** Monthly mean surface temperature T_ii, °C, January…December (12 values). */
  monthlyTemperatureC: readonly number[];
}

/** Annual rain-rate statistics of a site from its monthly normals (ITU-R P.837-7 Annex 1). */
export interface MonthlyRainClimate {
  /** P0_annual: percentage of an average year with rain, %. */
  p0Percent: number;
  /** R_p exceeded for p % of an average year, mm/h; 0 when p ≥ P0_annual. Accepts 0.0001 ≤ p ≤ 100. */
  rainRateExceeded(pPercent: number): number;
  /** P(R > r): percentage of an average year the rain rate exceeds r, %; r = 0 gives P0_annual. */
  probabilityExceeded(rainRateMmH: number): number;
}

/** Days per month N_ii, with February 28.25 (ITU-R P.837-7 Annex 1 step 1). */
export const DAYS_PER_MONTH_P837_7: readonly number[] = [31, 28.25, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
/** Days in an average year (ITU-R P.837-7 Annex 1 step 3). */
const DAYS_PER_YEAR_P837_7 = 365.25;
/** r_ii = 0.5874 e^{0.0883 T} for T ≥ 0 °C, 0.5874 below (ITU-R P.837-7 Annex 1 step 2), mm/h. */
const R_COEFFICIENT_MM_H_P837_7 = 0.5874;
const R_TEMPERATURE_SLOPE_PER_C_P837_7 = 0.0883;
/** Monthly rain probability cap, % (ITU-R P.837-7 Annex 1 step 3). */
const MAX_MONTHLY_P0_PERCENT_P837_7 = 70;
/** Log-normal parameters of the monthly rain-rate distribution (ITU-R P.837-7 Annex 1 step 4). */
const LN_OFFSET_P837_7 = 0.7938;
const LN_SIGMA_P837_7 = 1.26;
/** Accepted range of p for R_p, % (engine convention: wide, since the method has no stated limit). */
const MIN_P_PERCENT = 0.0001;
const MAX_P_PERCENT = 100;

/**
 * ITU-R P.837-7 Annex 1: the annual rain-rate distribution of a site from its 12 monthly mean
 * total rainfalls MT_ii (mm) and 12 monthly mean surface temperatures T_ii (°C).
 * Step 2: r_ii = 0.5874 e^{0.0883 T_ii} (T ≥ 0 °C) or 0.5874 (T < 0 °C), mm/h.
 * Step 3: P0_ii = 100 MT_ii/(24 N_ii r_ii) %; if above 70 %, P0_ii = 70 % and r_ii = (100/70) MT_ii/(24 N_ii).
 * Step 4: P_ii(R > r) = P0_ii Q((ln r + 0.7938 − ln r_ii)/1.26).
 * Step 5: P(R > r) = Σ N_ii P_ii(R > r)/365.25, P0_annual = Σ N_ii P0_ii/365.25.
 * Step 6: R_p is found by solving P(R > R_p) = p (Brent on ln R); R_p = 0 for p ≥ P0_annual.
 *
 * Bad input: lists not of 12 finite numbers, negative rainfall, temperature outside −90…60 °C,
 * p outside 0.0001–100 % or a negative rain rate throws EngineInputError naming the field
 * (e.g. `monthlyRainfallMm[3]`).
 *
 * @example
 * const climate = monthlyRainClimate({ monthlyRainfallMm: v8Rain, monthlyTemperatureC: v8Temp })
 * climate.p0Percent                // => 5.3615096… (ITU-R SG 3 validation example, site V8)
 * climate.rainRateExceeded(0.01)   // => 26.48052…
 */
export function monthlyRainClimate(options: MonthlyRainClimateOptions): MonthlyRainClimate {
  const mt = requireFiniteArray(options.monthlyRainfallMm, 'monthlyRainfallMm', 12);
  const temp = requireFiniteArray(options.monthlyTemperatureC, 'monthlyTemperatureC', 12);
  // The field name is built only for a value that fails (a campaign checks 24 values per site).
  const { min, max } = PHYSICAL_RANGES.monthlyRainfallMm;
  for (let i = 0; i < 12; i++) {
    if (!(mt[i] >= min && mt[i] <= max)) requireNumberInRange(mt[i], `monthlyRainfallMm[${i}]`, min, max, 'physical range');
    if (!(temp[i] >= -90 && temp[i] <= 60)) requireNumberInRange(temp[i], `monthlyTemperatureC[${i}]`, -90, 60);
  }

  // Per-month weights w_ii = N_ii P0_ii / 365.25 and log medians ln r_ii − 0.7938 (steps 2–4).
  const weights: number[] = [];
  const lnMedians: number[] = [];
  let p0 = 0;
  for (let i = 0; i < 12; i++) {
    if (mt[i] === 0) continue;
    const n = DAYS_PER_MONTH_P837_7[i];
    let r = temp[i] >= 0 ? R_COEFFICIENT_MM_H_P837_7 * Math.exp(R_TEMPERATURE_SLOPE_PER_C_P837_7 * temp[i]) : R_COEFFICIENT_MM_H_P837_7;
    let p0Month = (100 * mt[i]) / (24 * n * r);
    if (p0Month > MAX_MONTHLY_P0_PERCENT_P837_7) {
      p0Month = MAX_MONTHLY_P0_PERCENT_P837_7;
      r = ((100 / MAX_MONTHLY_P0_PERCENT_P837_7) * mt[i]) / (24 * n);
    }
    const w = (n * p0Month) / DAYS_PER_YEAR_P837_7;
    weights.push(w);
    lnMedians.push(Math.log(r) - LN_OFFSET_P837_7);
    p0 += w;
  }

  const exceeded = (lnR: number): number => {
    let sum = 0;
    for (let i = 0; i < weights.length; i++) sum += weights[i] * normalTail((lnR - lnMedians[i]) / LN_SIGMA_P837_7);
    return sum;
  };

  const probabilityExceeded = (rainRateMmH: number): number => {
    const r = requireNonNegative(rainRateMmH, 'rainRateMmH');
    return r === 0 ? p0 : exceeded(Math.log(r));
  };

  /** d/d(ln r) of P(R > r): −Σ w φ(z)/σ (the log-normal densities of step 4). */
  const slope = (lnR: number): number => {
    let sum = 0;
    for (let i = 0; i < weights.length; i++) {
      const z = (lnR - lnMedians[i]) / LN_SIGMA_P837_7;
      sum += weights[i] * Math.exp(-0.5 * z * z);
    }
    return -sum / (LN_SIGMA_P837_7 * Math.sqrt(2 * Math.PI));
  };

  const rainRateExceeded = (pPercent: number): number => {
    const p = requireNumberInRange(pPercent, 'pPercent', MIN_P_PERCENT, MAX_P_PERCENT);
    if (p >= p0) return 0;
    // Bracket in ln R: P(R > r) falls from P0 (r → 0) to 0 (r → ∞); widen until it straddles p.
    const lnTarget = Math.log(p);
    // Newton asks for g and its slope at the same point: keep P(R > r) of the last point.
    let lastLnR = Number.NaN;
    let lastExceeded = 0;
    const exceededAt = (lnR: number): number => {
      if (lnR !== lastLnR) {
        lastLnR = lnR;
        lastExceeded = Math.max(exceeded(lnR), 1e-300);
      }
      return lastExceeded;
    };
    const g = (lnR: number): number => Math.log(exceededAt(lnR)) - lnTarget;
    let lo = Math.log(1);
    let hi = Math.log(100);
    while (g(lo) < 0) lo -= 4;
    while (g(hi) > 0) hi += 2;
    return Math.exp(newtonInBracket(g, (x) => slope(x) / exceededAt(x), lo, hi));
  };

  return { p0Percent: p0, rainRateExceeded, probabilityExceeded };
}
