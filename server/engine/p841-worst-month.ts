import { requireNumberInRange } from './validate';

/** ITU-R P.841 global rain parameters Q1 and β (from memory; the tests say so). */
export const WORST_MONTH_Q1_P841 = 2.85;
export const WORST_MONTH_BETA_P841 = 0.13;
/** A month cannot hold more than 12 times the annual share (ITU-R P.841 caps Q at 12, from memory). */
const MAX_Q_P841 = 12;
/** From 3 % to 30 % of the year P.841 holds Q at its 3 % value (from memory). */
const Q_FLAT_ABOVE_P_PERCENT_P841 = 3;
/** Above 30 % P.841 lets Q fall from its 3 % value to 1 at 100 % (from memory). */
const Q_FALLS_ABOVE_P_PERCENT_P841 = 30;

/**
 * Worst-month percentage p_w for an annual percentage p (ITU-R P.841): p_w = Q · p with
 * Q = Q1 p^(−β), i.e. p_w = Q1 p^(1−β), Q1 = 2.85, β = 0.13 (global rain values, from memory).
 * Q is capped at 12 (tiny p), held at its 3 % value for 3 % < p ≤ 30 %, and above 30 % falls as
 * Q = Q_3 (p/30)^(log10 Q_3 / log10 0.3) with Q_3 = Q1·3^−β, reaching 1 at p = 100 % (a month
 * cannot be worse than "always"); p_w is capped at 100 %. All four branches from memory of P.841.
 *
 * Bad input: p outside 0–100 % or NaN throws EngineInputError('pPercent'). p = 0 gives 0.
 *
 * @example
 * worstMonthPercent({ pPercent: 0.01 }) // => 0.05186… (2.85 × 0.01^0.87)
 */
export function worstMonthPercent(options: { pPercent: number }): number {
  const p = requireNumberInRange(options.pPercent, 'pPercent', 0, 100);
  return worstMonthPercentUnchecked(p);
}

/** {@link worstMonthPercent} without validation (hot path). */
export function worstMonthPercentUnchecked(p: number): number {
  if (p <= 0) return 0;
  const q3 = WORST_MONTH_Q1_P841 * Q_FLAT_ABOVE_P_PERCENT_P841 ** -WORST_MONTH_BETA_P841;
  const q = p > Q_FALLS_ABOVE_P_PERCENT_P841
    ? q3 * (p / Q_FALLS_ABOVE_P_PERCENT_P841) ** (Math.log10(q3) / Math.log10(0.3))
    : p > Q_FLAT_ABOVE_P_PERCENT_P841
      ? q3
      : Math.min(MAX_Q_P841, WORST_MONTH_Q1_P841 * p ** -WORST_MONTH_BETA_P841);
  return Math.min(100, q * p);
}
