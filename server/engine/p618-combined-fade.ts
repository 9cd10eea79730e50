import { totalAttenuationCurve } from './p618-total-attenuation';
import type { RainExceedance, RainPath } from './p618-rain-path';

/**
 * Rain plus scintillation, combined per ITU-R P.618-14 §2.5 with gases and clouds left out:
 * A_T(p) = √(A_R(p)² + A_S(p)²), and its inverse (the largest p in 0.001–5 % whose A_T reaches a
 * fade threshold). A_S(p) = a(p) σ (§2.4.1 steps 8–9) follows the step 8 polynomial below 0.01 %
 * too, as the ITU-R SG 3 validation examples of §2.5 do (see totalAttenuationCurve).
 *
 * Bad input: callers pass a prepared path and a validated σ ≥ 0; a threshold ≤ 0 is
 * 'above-model-range'.
 *
 * @example
 * // rainPath = prepareRainPath(site V8 at 14.25 GHz), σ of a 1 m dish with N_wet 50.39
 * combinedFadeExceedance({ rainPath, scintillationSigmaDb: 0.0873106, attenuationDb: 6.798072267 })
 * // => { pPercent: 0.010103…, bound: 'none' } (rain alone: 0.01 %)
 */
export function combinedFadeExceedance(o: { rainPath: RainPath; scintillationSigmaDb: number; attenuationDb: number; rainOnHeldScan?: readonly number[] }): RainExceedance {
  return totalAttenuationCurve({ rainPath: o.rainPath, atmosphericPath: null, scintillationSigmaDb: o.scintillationSigmaDb, rainOnHeldScan: o.rainOnHeldScan }).exceedanceOf(o.attenuationDb);
}
