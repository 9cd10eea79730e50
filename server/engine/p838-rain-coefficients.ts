import { PHYSICAL_RANGES } from './physical-ranges';
import { requireNumberInRange } from './validate';

/** Options of {@link rainCoefficients}. */
export interface RainCoefficientsOptions {
  /** Carrier frequency, GHz. ITU-R P.838-3 is fitted for 1–1000 GHz. */
  frequencyGHz: number;
  /** Path elevation angle θ, degrees, 0–90. */
  elevationDeg: number;
  /** Polarization tilt angle τ relative to the horizontal, degrees (0 horizontal, 90 vertical, 45 circular). */
  tiltDeg: number;
}

/** k and α of γ_R = k R^α (ITU-R P.838-3). */
export interface RainCoefficients {
  /** Coefficient k (dB/km per (mm/h)^α). */
  k: number;
  /** Exponent α (dimensionless). */
  alpha: number;
}

/** ITU-R P.838-3 eq. (2): four Gaussian terms plus a line in log10 f give log10 k. */
interface GaussianFit {
  a: readonly number[];
  b: readonly number[];
  c: readonly number[];
  m: number;
  c0: number;
}

/** ITU-R P.838-3 Table 1 (k_H). */
const K_H_P838_3: GaussianFit = {
  a: [-5.3398, -0.35351, -0.23789, -0.94158],
  b: [-0.10008, 1.2697, 0.86036, 0.64552],
  c: [1.13098, 0.454, 0.15354, 0.16817],
  m: -0.18961,
  c0: 0.71147,
};
/** ITU-R P.838-3 Table 2 (k_V). */
const K_V_P838_3: GaussianFit = {
  a: [-3.80595, -3.44965, -0.39902, 0.50167],
  b: [0.56934, -0.22911, 0.73042, 1.07319],
  c: [0.81061, 0.51059, 0.11899, 0.27195],
  m: -0.16398,
  c0: 0.63297,
};
/** ITU-R P.838-3 Table 3 (α_H). */
const ALPHA_H_P838_3: GaussianFit = {
  a: [-0.14318, 0.29591, 0.32177, -5.3761, 16.1721],
  b: [1.82442, 0.77564, 0.63773, -0.9623, -3.2998],
  c: [-0.55187, 0.19822, 0.13164, 1.47828, 3.4399],
  m: 0.67849,
  c0: -1.95537,
};
/** ITU-R P.838-3 Table 4 (α_V). */
const ALPHA_V_P838_3: GaussianFit = {
  a: [-0.07771, 0.56727, -0.20238, -48.2991, 48.5833],
  b: [2.3384, 0.95545, 1.1452, 0.791669, 0.791459],
  c: [-0.76284, 0.54039, 0.26809, 0.116226, 0.116479],
  m: -0.053739,
  c0: 0.83433,
};

const MIN_FREQUENCY_GHZ_P838_3 = 1;
const MAX_FREQUENCY_GHZ_P838_3 = 1000;
const DEG_TO_RAD = Math.PI / 180;

function evaluateFit(fit: GaussianFit, log10f: number): number {
  let sum = fit.m * log10f + fit.c0;
  for (let j = 0; j < fit.a.length; j++) {
    const z = (log10f - fit.b[j]) / fit.c[j];
    sum += fit.a[j] * Math.exp(-z * z);
  }
  return sum;
}

/** Horizontal and vertical coefficients at one frequency (no validation; internal hot path). */
export function rainCoefficientsHV(frequencyGHz: number): { kH: number; kV: number; alphaH: number; alphaV: number } {
  const lf = Math.log10(frequencyGHz);
  return {
    kH: 10 ** evaluateFit(K_H_P838_3, lf),
    kV: 10 ** evaluateFit(K_V_P838_3, lf),
    alphaH: evaluateFit(ALPHA_H_P838_3, lf),
    alphaV: evaluateFit(ALPHA_V_P838_3, lf),
  };
}

/** Unchecked combination for tilt and elevation (ITU-R P.838-3 eqs. (4) and (5)). */
export function combineRainCoefficients(frequencyGHz: number, elevationDeg: number, tiltDeg: number): RainCoefficients {
  const { kH, kV, alphaH, alphaV } = rainCoefficientsHV(frequencyGHz);
  const cosEl = Math.cos(elevationDeg * DEG_TO_RAD);
  const w = cosEl * cosEl * Math.cos(2 * tiltDeg * DEG_TO_RAD);
  const k = (kH + kV + (kH - kV) * w) / 2;
  const alpha = (kH * alphaH + kV * alphaV + (kH * alphaH - kV * alphaV) * w) / (2 * k);
  return { k, alpha };
}

/**
 * ITU-R P.838-3 regression coefficients k and α for a path of elevation θ and polarization
 * tilt τ: k_H, k_V, α_H, α_V from eqs. (2)–(3) with Tables 1–4, combined by eqs. (4)–(5):
 * k = [k_H + k_V + (k_H − k_V) cos²θ cos 2τ]/2 and
 * α = [k_H α_H + k_V α_V + (k_H α_H − k_V α_V) cos²θ cos 2τ]/(2k).
 *
 * Bad input: frequency outside 1–1000 GHz, elevation outside 0–90°, or any non-finite value
 * throws EngineInputError naming the field.
 *
 * @example
 * rainCoefficients({ frequencyGHz: 14.25, elevationDeg: 31.07699124, tiltDeg: 0 })
 * // => { k: 0.03975488…, alpha: 1.12418043… } (ITU-R SG 3 validation example)
 */
export function rainCoefficients(options: RainCoefficientsOptions): RainCoefficients {
  const f = requireNumberInRange(
    options.frequencyGHz,
    'frequencyGHz',
    MIN_FREQUENCY_GHZ_P838_3,
    MAX_FREQUENCY_GHZ_P838_3,
    'ITU-R P.838-3 is fitted for 1–1000 GHz',
  );
  const el = requireNumberInRange(options.elevationDeg, 'elevationDeg', 0, 90);
  const tilt = requireNumberInRange(options.tiltDeg, 'tiltDeg', PHYSICAL_RANGES.tiltDeg.min, PHYSICAL_RANGES.tiltDeg.max, 'physical range');
  return combineRainCoefficients(f, el, tilt);
}
