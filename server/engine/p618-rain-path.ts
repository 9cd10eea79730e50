import { sampleCurve, type SampledCurve } from './math/largest-crossing';
import { combineRainCoefficients } from './p838-rain-coefficients';
import { requireFinite, requireNumberInRange } from './validate';
import { EngineInputError } from './errors';
import { PHYSICAL_RANGES } from './physical-ranges';

/** Inputs of the ITU-R P.618-14 §2.2.1.1 rain attenuation method (steps 1–9). */
export interface RainPathOptions {
  /** Site latitude φ, degrees (north positive). Enters step 7 (χ) and step 10 (β). */
  latDeg: number;
  /** Station height above mean sea level h_s, km. */
  stationHeightKm: number;
  /** Frequency, GHz (P.618-14 is stated for 1–55 GHz). */
  frequencyGHz: number;
  /** Elevation angle θ, degrees, above 0 (a satellite at or below the horizon is refused). */
  elevationDeg: number;
  /** Polarization tilt τ, degrees (0 horizontal, 90 vertical, 45 circular). */
  tiltDeg: number;
  /** Rain rate exceeded for 0.01 % of an average year R_0.01, mm/h. */
  r001MmH: number;
  /** Rain height h_R, km (ITU-R P.839-4: h_0 + 0.36 km). */
  rainHeightKm: number;
}

/** Bound flag for an exceedance outside the P.618 model range 0.001–5 %. */
export type ExceedanceBound = 'none' | 'below-model-range' | 'above-model-range';

/**
 * Percentage of an average year for which an attenuation is exceeded.
 * Convention: `bound: 'below-model-range'` → the true value is below 0.001 % and `pPercent`
 * is the upper bound 0.001; `'above-model-range'` → above 5 % and `pPercent` is the lower
 * bound 5. Never an invented number outside the range.
 */
export interface RainExceedance {
  pPercent: number;
  bound: ExceedanceBound;
}

/** The prepared path: steps 1–9 done once; step 10 and its inverse are then cheap. */
export interface RainPath {
  /** Step 9: attenuation exceeded for 0.01 % of an average year, dB. */
  readonly a001Db: number;
  /** Step 2: slant-path length below the rain height L_s, km. */
  readonly slantPathKm: number;
  /** Step 3: horizontal projection L_G, km. */
  readonly horizontalProjectionKm: number;
  /** Step 5: specific attenuation γ_R at R_0.01, dB/km. */
  readonly specificAttenuationDbKm: number;
  /** Step 6: horizontal reduction factor r_0.01. */
  readonly horizontalReduction: number;
  /** Step 7: vertical adjustment factor ν_0.01. */
  readonly verticalAdjustment: number;
  /** Step 8: effective path length L_E, km. */
  readonly effectivePathKm: number;
  /** Largest A_p over the model range (at p = 0.001 %, or just above it where step 10 is not monotone), dB. */
  readonly maxAttenuationDb: number;
  /** A_p at p = 5 %, the upper end of the model range, dB. */
  readonly minAttenuationDb: number;
  /** Step 10, p already checked to lie in 0.001–5 %. */
  attenuationAt(pPercent: number): number;
  /** Step 10 as ln A_p of ln p (the solvers work on logarithms; saves an exp/log pair per call). */
  lnAttenuationAt(lnPPercent: number): number;
  /**
   * Inverse of step 10: the LARGEST p in the model range with A_p ≥ the attenuation (Brent on
   * ln p after a grid scan), so a non-monotone step 10 never hides a real p; attenuation ≥ 0.
   */
  exceedanceOf(attenuationDb: number): RainExceedance;
}

/** Effective Earth radius for the low-elevation slant path, km (ITU-R P.618-14 §2.2.1.1 step 2). */
export const EFFECTIVE_EARTH_RADIUS_KM_P618_14 = 8500;
/** Lower end of the P.618-14 step 10 range, % of an average year. */
export const MIN_P_PERCENT_P618_14 = 0.001;
/** Upper end of the P.618-14 step 10 range, % of an average year. */
export const MAX_P_PERCENT_P618_14 = 5;
/** Frequency range for which P.618-14 rain attenuation is stated, GHz. */
export const MIN_FREQUENCY_GHZ_P618_14 = 1;
export const MAX_FREQUENCY_GHZ_P618_14 = 55;
/**
 * An attenuation within 1e-8 (relative) of A_0.001 or A_5 is reported as the range end itself
 * with bound 'none': the difference is rounding, not physics (engine convention).
 */
const RANGE_END_SNAP_LN = 1e-8;

const DEG = Math.PI / 180;
const LN_P_MIN = Math.log(MIN_P_PERCENT_P618_14);
const LN_P_MAX = Math.log(MAX_P_PERCENT_P618_14);
const LN_P_REF = Math.log(0.01);

/**
 * Validate the P.618 inputs; the rule for bad input is EngineInputError naming the field,
 * with `elevationDeg ≤ 0` reported as "satellite at or below the horizon".
 */
export function checkRainPathOptions(o: RainPathOptions, prefix = ''): void {
  requireNumberInRange(o.latDeg, `${prefix}latDeg`, -90, 90);
  requireNumberInRange(o.stationHeightKm, `${prefix}stationHeightKm`, -1, 10);
  requireNumberInRange(
    o.frequencyGHz,
    `${prefix}frequencyGHz`,
    MIN_FREQUENCY_GHZ_P618_14,
    MAX_FREQUENCY_GHZ_P618_14,
    'ITU-R P.618-14 rain attenuation is stated for 1–55 GHz',
  );
  const el = requireFinite(o.elevationDeg, `${prefix}elevationDeg`);
  if (el <= 0) throw new EngineInputError(`${prefix}elevationDeg`, `satellite at or below the horizon (elevation ${el}°)`, el);
  if (el > 90) throw new EngineInputError(`${prefix}elevationDeg`, `must be at most 90°; got ${el}`, el);
  requireNumberInRange(o.tiltDeg, `${prefix}tiltDeg`, PHYSICAL_RANGES.tiltDeg.min, PHYSICAL_RANGES.tiltDeg.max, 'physical range');
  requireNumberInRange(o.r001MmH, `${prefix}r001MmH`, PHYSICAL_RANGES.r001MmH.min, PHYSICAL_RANGES.r001MmH.max, 'physical range');
  requireNumberInRange(o.rainHeightKm, `${prefix}rainHeightKm`, -1, 10.36);
}

/**
 * ITU-R P.618-14 §2.2.1.1 steps 1–9, done once for a path, returning step 10 and its inverse.
 *
 * Step 2: L_s = (h_R − h_s)/sin θ for θ ≥ 5°, else 2(h_R − h_s)/(√(sin²θ + 2(h_R − h_s)/R_e) + sin θ);
 * h_R ≤ h_s gives A = 0. Step 3: L_G = L_s cos θ. Step 5: γ_R = k R^α (P.838-3).
 * Step 6: r = 1/(1 + 0.78 √(L_G γ_R/f) − 0.38(1 − e^{−2 L_G})).
 * Step 7: ζ = atan((h_R − h_s)/(L_G r)); L_R = L_G r/cos θ if ζ > θ else (h_R − h_s)/sin θ;
 * χ = 36 − |φ| for |φ| < 36° else 0; ν = 1/(1 + √sin θ (31(1 − e^{−θ/(1+χ)}) √(L_R γ_R)/f² − 0.45)).
 * Step 8: L_E = L_R ν. Step 9: A_0.01 = γ_R L_E.
 * Step 10: A_p = A_0.01 (p/0.01)^−(0.655 + 0.033 ln p − 0.045 ln A_0.01 − β(1 − p) sin θ), with
 * β = 0 if p ≥ 1 % or |φ| ≥ 36°; β = −0.005(|φ| − 36) if θ ≥ 25°; else
 * β = −0.005(|φ| − 36) + 1.8 − 4.25 sin θ.
 *
 * Bad input: see {@link checkRainPathOptions}.
 *
 * @example
 * prepareRainPath({ latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25,
 *   elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333 }).a001Db
 * // => 6.798072… (ITU-R SG 3 validation example)
 */
export function prepareRainPath(options: RainPathOptions): RainPath {
  checkRainPathOptions(options);
  return prepareRainPathUnchecked(options);
}

/** {@link prepareRainPath} without validation, for callers that validated already (hot path). */
export function prepareRainPathUnchecked(o: RainPathOptions): RainPath {
  const theta = o.elevationDeg;
  const sinT = Math.sin(theta * DEG);
  const cosT = Math.cos(theta * DEG);
  const absLat = Math.abs(o.latDeg);
  const f = o.frequencyGHz;
  const dh = o.rainHeightKm - o.stationHeightKm; // step 1 done by caller (h_R given)

  // β for p < 1 % (step 10); p ≥ 1 % always uses β = 0.
  const betaBelow1 = absLat >= 36 ? 0 : theta >= 25 ? -0.005 * (absLat - 36) : -0.005 * (absLat - 36) + 1.8 - 4.25 * sinT;

  if (dh <= 0 || o.r001MmH <= 0) {
    return zeroPath(dh > 0 ? pathLength(dh, theta, sinT) : 0, cosT);
  }
  const ls = pathLength(dh, theta, sinT); // step 2
  const lg = ls * cosT; // step 3
  const { k, alpha } = combineRainCoefficients(f, theta, o.tiltDeg);
  const gamma = k * o.r001MmH ** alpha; // step 5
  const r001 = 1 / (1 + 0.78 * Math.sqrt((lg * gamma) / f) - 0.38 * (1 - Math.exp(-2 * lg))); // step 6
  const zetaDeg = Math.atan(dh / (lg * r001)) / DEG; // step 7
  const lr = zetaDeg > theta ? (lg * r001) / cosT : dh / sinT;
  const chi = absLat < 36 ? 36 - absLat : 0;
  const nu = 1 / (1 + Math.sqrt(sinT) * ((31 * (1 - Math.exp(-(theta / (1 + chi)))) * Math.sqrt(lr * gamma)) / (f * f) - 0.45));
  const le = lr * nu; // step 8
  const a001 = gamma * le; // step 9
  // A rain rate so small that γ_R underflows (e.g. 5e-324 mm/h) is no rain: ln 0 would poison step 10.
  if (!(a001 > 0) || !Number.isFinite(a001)) return zeroPath(ls, cosT);
  const lnA001 = Math.log(a001);
  const c0 = 0.655 - 0.045 * lnA001;
  const betaSin = betaBelow1 * sinT;

  /** ln A_p for ln p = lp (step 10). */
  const lnAttenuation = (lp: number): number => {
    const p = Math.exp(lp);
    const exponent = p >= 1 ? c0 + 0.033 * lp : c0 + 0.033 * lp - betaSin * (1 - p);
    return lnA001 - exponent * (lp - LN_P_REF);
  };
  const attenuationAt = (pPercent: number): number => Math.exp(lnAttenuation(Math.log(pPercent)));
  // Sampled lazily: most callers only need A_0.01 or a few A_p.
  let curve: SampledCurve | null = null;
  const sampled = (): SampledCurve => (curve ??= sampleCurve(lnAttenuation, LN_P_MIN, LN_P_MAX));
  const lnMin = lnAttenuation(LN_P_MAX);

  const exceedanceOf = (attenuationDb: number): RainExceedance => exceedanceOnCurve(sampled(), lnMin, attenuationDb);

  return {
    a001Db: a001,
    slantPathKm: ls,
    horizontalProjectionKm: lg,
    specificAttenuationDbKm: gamma,
    horizontalReduction: r001,
    verticalAdjustment: nu,
    effectivePathKm: le,
    get maxAttenuationDb(): number {
      return Math.exp(sampled().peak);
    },
    minAttenuationDb: Math.exp(lnMin),
    attenuationAt,
    lnAttenuationAt: lnAttenuation,
    exceedanceOf,
  };
}

/**
 * Exceedance of an attenuation on a sampled ln A(ln p) curve, with the model-range bounds of
 * {@link RainExceedance}: the largest p whose A_p reaches it; a value within 1e-8 (in ln) of the
 * curve's peak or of A_5 is the range end itself (rounding, not physics).
 */
export function exceedanceOnCurve(curve: SampledCurve, lnAtMaxP: number, attenuationDb: number): RainExceedance {
  if (attenuationDb <= 0) return { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
  const lnA = Math.log(attenuationDb);
  const c = curve.largestReaching(lnA);
  if (c.kind === 'everywhere') {
    return lnA >= lnAtMaxP - RANGE_END_SNAP_LN ? { pPercent: MAX_P_PERCENT_P618_14, bound: 'none' } : { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
  }
  if (c.kind === 'never') {
    return lnA <= curve.peak + RANGE_END_SNAP_LN ? { pPercent: clampP(Math.exp(curve.peakX)), bound: 'none' } : { pPercent: MIN_P_PERCENT_P618_14, bound: 'below-model-range' };
  }
  return { pPercent: clampP(Math.exp(c.x)), bound: 'none' };
}

function clampP(p: number): number {
  return Math.min(MAX_P_PERCENT_P618_14, Math.max(MIN_P_PERCENT_P618_14, p));
}

/** Step 2 slant-path length below the rain height, km. */
function pathLength(dh: number, theta: number, sinT: number): number {
  if (theta >= 5) return dh / sinT;
  return (2 * dh) / (Math.sqrt(sinT * sinT + (2 * dh) / EFFECTIVE_EARTH_RADIUS_KM_P618_14) + sinT);
}

/** Step 2 / step 4: station above the rain height, or R_0.01 = 0 → A_p = 0 for every p. */
function zeroPath(ls: number, cosT: number): RainPath {
  return {
    a001Db: 0,
    slantPathKm: ls,
    horizontalProjectionKm: ls * cosT,
    specificAttenuationDbKm: 0,
    horizontalReduction: 1,
    verticalAdjustment: 1,
    effectivePathKm: 0,
    maxAttenuationDb: 0,
    minAttenuationDb: 0,
    attenuationAt: () => 0,
    lnAttenuationAt: () => Number.NEGATIVE_INFINITY,
    // No rain fade at all: every threshold ≥ 0 dB is exceeded less than 0.001 % of the time.
    exceedanceOf: () => ({ pPercent: MIN_P_PERCENT_P618_14, bound: 'below-model-range' }),
  };
}
