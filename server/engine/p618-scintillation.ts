import { EngineInputError } from './errors';
import { requireNumberInRange, requirePositive } from './validate';

/** Options of {@link scintillationFade}. */
export interface ScintillationFadeOptions {
  /** Frequency f, GHz. P.618-14 §2.4.1 was tested for 4–20 GHz; the engine accepts 1–55 GHz (see below). */
  frequencyGHz: number;
  /** Elevation θ, degrees; the §2.4.1 method is for θ ≥ 5°. */
  elevationDeg: number;
  /** Physical antenna diameter D, m. */
  diameterM: number;
  /** Antenna efficiency η (0 < η ≤ 1); 0.5 if unknown per P.618-14 step 5 (conservative). */
  efficiency: number;
  /** Wet term of the surface refractivity N_wet (ITU-R P.453), N-units. */
  nWet: number;
  /**
   * Percentage of time, 0.001–50 %. Step 8 is written for 0.01 < p ≤ 50 %; below 0.01 % the
   * engine keeps following the step 8 polynomial, as the ITU-R SG 3 validation examples of
   * P.618-13 §2.5 do at 0.001 % (a(p) rises smoothly there; holding it flat understates fades).
   */
  pPercent: number;
}

/** Height of the turbulent layer h_L, m (ITU-R P.618-14 §2.4.1 step 4). */
const TURBULENT_LAYER_HEIGHT_M_P618_14 = 1000;
/** Smallest elevation for the §2.4.1 method, degrees (ITU-R P.618-14 §2.4.1). */
const MIN_ELEVATION_DEG_P618_14_SCINTILLATION = 5;
const DEG = Math.PI / 180;

/**
 * Tropospheric scintillation fade depth A_s(p) exceeded for p % of the time, dB:
 * ITU-R P.618-14 §2.4.1 steps 3–9, with N_wet supplied (steps 1–2 / P.453).
 * Step 3: σ_ref = 3.6e-3 + 1e-4 N_wet. Step 4: L = 2 h_L/(√(sin²θ + 2.35e-4) + sin θ), h_L = 1000 m.
 * Step 5: D_eff = √η D. Step 6: x = 1.22 D_eff² f/L,
 * g(x) = √(3.86 (x² + 1)^{11/12} sin((11/6) atan(1/x)) − 7.08 x^{5/6}) (0 when the root argument is negative).
 * Step 7: σ = σ_ref f^{7/12} g(x)/(sin θ)^{1.2}.
 * Step 8: a(p) = −0.061 (log p)³ + 0.072 (log p)² − 1.71 log p + 3.0. Step 9: A_s = a(p) σ.
 *
 * Frequencies 1–55 GHz are accepted so Ka-band studies can show the layer, but outside the
 * 4–20 GHz of the Recommendation's tests the figure is an extrapolation of the method.
 *
 * Bad input: p outside 0.001–50 %, θ < 5°, frequency outside 1–55 GHz, D ≤ 0, η outside (0, 1],
 * N_wet outside 0–200 or NaN throws EngineInputError naming the field.
 *
 * @example
 * scintillationFade({ frequencyGHz: 14.25, elevationDeg: 31.076991235657, diameterM: 1,
 *   efficiency: 0.65, nWet: 50.38926222, pPercent: 1 })
 * // => 0.2619318… (ITU-R SG 3 validation example)
 */
export function scintillationFade(options: ScintillationFadeOptions): number {
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 1, 55);
  const el = requireNumberInRange(options.elevationDeg, 'elevationDeg', -90, 90);
  if (el < MIN_ELEVATION_DEG_P618_14_SCINTILLATION) {
    throw new EngineInputError('elevationDeg', 'ITU-R P.618-14 §2.4.1 scintillation is for elevations of 5° and above', el);
  }
  const d = requirePositive(options.diameterM, 'diameterM');
  const eta = requirePositive(options.efficiency, 'efficiency');
  if (eta > 1) throw new EngineInputError('efficiency', `must be at most 1; got ${eta}`, eta);
  const nWet = requireNumberInRange(options.nWet, 'nWet', 0, 200);
  const p = requireNumberInRange(options.pPercent, 'pPercent', 0.001, 50, 'ITU-R P.618-14 §2.4.1 step 8 covers 0.01–50 %, extended to the 0.001 % of the §2.5 validation examples');
  return scintillationSigmaUnchecked(f, el, d, eta, nWet) * scintillationTimeFactor(p);
}

/** Steps 3–7: standard deviation of the signal σ, dB (inputs already validated). */
export function scintillationSigmaUnchecked(
  frequencyGHz: number,
  elevationDeg: number,
  diameterM: number,
  efficiency: number,
  nWet: number,
): number {
  const sigmaRef = 3.6e-3 + 1e-4 * nWet; // step 3
  const sinT = Math.sin(elevationDeg * DEG);
  const l = (2 * TURBULENT_LAYER_HEIGHT_M_P618_14) / (Math.sqrt(sinT * sinT + 2.35e-4) + sinT); // step 4
  const dEff = Math.sqrt(efficiency) * diameterM; // step 5
  const x = (1.22 * dEff * dEff * frequencyGHz) / l; // step 6
  const g2 = 3.86 * (x * x + 1) ** (11 / 12) * Math.sin((11 / 6) * Math.atan(1 / x)) - 7.08 * x ** (5 / 6);
  const g = g2 > 0 ? Math.sqrt(g2) : 0;
  return (sigmaRef * frequencyGHz ** (7 / 12) * g) / sinT ** 1.2; // step 7
}

/** Step 8: time-percentage factor a(p). */
export function scintillationTimeFactor(pPercent: number): number {
  return scintillationTimeFactorLn(Math.log(pPercent));
}

/** Step 8 with ln p given (log10 p = ln p / ln 10). */
export function scintillationTimeFactorLn(lnPPercent: number): number {
  const lp = lnPPercent * Math.LOG10E;
  return -0.061 * lp * lp * lp + 0.072 * lp * lp - 1.71 * lp + 3.0;
}
