import { brentRoot } from './math/brent';
import { scintillationTimeFactor } from './p618-scintillation';
import { MAX_P_PERCENT_P618_14, MIN_P_PERCENT_P618_14, type RainExceedance, type RainPath } from './p618-rain-path';

/** Below this p the scintillation term is held at its 0.01 % value (§2.4.1 step 8 stops there; engine convention). */
const SCINTILLATION_MIN_P_PERCENT_P618_14 = 0.01;
const LN_P_MIN = Math.log(MIN_P_PERCENT_P618_14);
const LN_P_MAX = Math.log(MAX_P_PERCENT_P618_14);

/**
 * Rain plus scintillation, combined per ITU-R P.618-14 §2.5 with gases and clouds left out:
 * A_T(p) = √(A_R(p)² + A_S(p)²), and its inverse (percentage of the year A_T exceeds a fade
 * threshold). A_S(p) = a(p) σ (§2.4.1 steps 8–9) is held at its 0.01 % value for p < 0.01 %,
 * where step 8 is not defined (engine convention, stated on the result). Both terms fall with p,
 * so the inverse is Brent on ln p in [0.001, 5] % with the same bounds as the rain-only inverse.
 *
 * Bad input: callers pass a prepared path and a validated σ ≥ 0; a threshold ≤ 0 is
 * 'above-model-range'.
 *
 * @example
 * // rainPath = prepareRainPath(site V8 at 14.25 GHz), σ of a 1 m dish with N_wet 50.39
 * combinedFadeExceedance({ rainPath, scintillationSigmaDb: 0.0873106, attenuationDb: 6.798072267 })
 * // => { pPercent: 0.010103…, bound: 'none' } (rain alone: 0.01 %)
 */
export function combinedFadeExceedance(o: { rainPath: RainPath; scintillationSigmaDb: number; attenuationDb: number }): RainExceedance {
  const total = (lp: number): number => {
    const p = Math.exp(lp);
    const ar = o.rainPath.attenuationAt(p);
    const as = o.scintillationSigmaDb * scintillationTimeFactor(Math.max(p, SCINTILLATION_MIN_P_PERCENT_P618_14));
    return Math.sqrt(ar * ar + as * as);
  };
  const a = o.attenuationDb;
  if (a <= 0) return { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
  const aMax = total(LN_P_MIN);
  const aMin = total(LN_P_MAX);
  if (a > aMax) return { pPercent: MIN_P_PERCENT_P618_14, bound: 'below-model-range' };
  if (a < aMin) return { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
  const lp = brentRoot((x) => total(x) - a, LN_P_MIN, LN_P_MAX, 1e-12);
  return { pPercent: Math.min(MAX_P_PERCENT_P618_14, Math.max(MIN_P_PERCENT_P618_14, Math.exp(lp))), bound: 'none' };
}
