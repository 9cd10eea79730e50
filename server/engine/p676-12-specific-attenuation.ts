import { OXYGEN_LINES_P676_12, WATER_VAPOUR_LINES_P676_12 } from './p676-12-line-data';
import { requireNumberInRange } from './validate';

/** Inputs of {@link gasSpecificAttenuation}: the atmosphere at one point. */
export interface GasSpecificAttenuationOptions {
  /** Frequency f, GHz (ITU-R P.676-12 Annex 1 covers 1–1 000 GHz). */
  frequencyGHz: number;
  /** Dry-air pressure p, hPa. */
  pressureHpa: number;
  /** Temperature T, K. */
  temperatureK: number;
  /** Water-vapour density ρ, g/m³. */
  vapourDensityGM3: number;
}

/** Oxygen and water-vapour specific attenuation, dB/km. */
export interface GasSpecificAttenuation {
  /** γ_o: oxygen lines plus the dry continuum (pressure-induced nitrogen and Debye), dB/km. */
  oxygenDbKm: number;
  /** γ_w: water-vapour lines, dB/km. */
  waterVapourDbKm: number;
}

/** e = ρ T / 216.7 (ITU-R P.676-12 Annex 1 eq. 4): water-vapour partial pressure, hPa. */
export function vapourPressureHpa(vapourDensityGM3: number, temperatureK: number): number {
  return (vapourDensityGM3 * temperatureK) / 216.7;
}

/**
 * Line-by-line specific attenuation of ITU-R P.676-12 Annex 1: γ = 0.1820 f (N''_oxygen + N''_water)
 * with every line of Tables 1 and 2 (eqs. 1–9), the oxygen Zeeman width floor (eq. 6b) and the
 * Doppler-corrected water-vapour width (eq. 6c), and the dry continuum N''_D (eq. 8).
 *
 * Bad input: frequency outside 1–1 000 GHz, pressure outside 0–1 100 hPa, temperature outside
 * 150–350 K or ρ outside 0–60 g/m³ (or NaN) throws EngineInputError naming the field.
 *
 * @example
 * gasSpecificAttenuation({ frequencyGHz: 12, pressureHpa: 1013.25, temperatureK: 288.15, vapourDensityGM3: 7.5 })
 * // => { oxygenDbKm: 0.0086982…, waterVapourDbKm: 0.0095353… } (ITU-R SG 3 validation example)
 */
export function gasSpecificAttenuation(options: GasSpecificAttenuationOptions): GasSpecificAttenuation {
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 1, 1000, 'ITU-R P.676-12 Annex 1 covers 1–1 000 GHz');
  const p = requireNumberInRange(options.pressureHpa, 'pressureHpa', 0, 1100);
  const t = requireNumberInRange(options.temperatureK, 'temperatureK', 150, 350);
  const rho = requireNumberInRange(options.vapourDensityGM3, 'vapourDensityGM3', 0, 60);
  return {
    oxygenDbKm: oxygenSpecificAttenuationUnchecked(f, p, t, rho),
    waterVapourDbKm: waterVapourSpecificAttenuationUnchecked(f, p, t, rho),
  };
}

/** γ_o, dB/km (inputs already validated). */
export function oxygenSpecificAttenuationUnchecked(f: number, p: number, t: number, rho: number): number {
  const theta = 300 / t;
  const e = vapourPressureHpa(rho, t);
  const theta3 = theta * theta * theta;
  const theta08 = theta ** 0.8;
  const lnTheta = Math.log(theta);
  let sum = 0;
  // Indexed rows, not destructuring for…of: this runs for every gas evaluation of every campaign
  // site, and each destructured row allocated an iterator (seen in a heap-allocation profile).
  for (let i = 0; i < OXYGEN_LINES_P676_12.length; i++) {
    const row = OXYGEN_LINES_P676_12[i];
    const fi = row[0], a1 = row[1], a2 = row[2], a3 = row[3], a4 = row[4], a5 = row[5], a6 = row[6];
    const s = a1 * 1e-7 * p * theta3 * Math.exp(a2 * (1 - theta));
    let df = a3 * 1e-4 * (p * (a4 === 0 ? theta08 : Math.exp((0.8 - a4) * lnTheta)) + 1.1 * e * theta);
    df = Math.sqrt(df * df + 2.25e-6); // eq. 6b: Zeeman splitting
    const delta = (a5 + a6 * theta) * 1e-4 * (p + e) * theta08;
    sum += s * lineShape(f, fi, df, delta);
  }
  // eq. 8: dry continuum (oxygen Debye spectrum below 10 GHz and pressure-induced nitrogen).
  const d = 5.6e-4 * (p + e) * theta08;
  const nD = f * p * theta * theta * (6.14e-5 / (d * (1 + (f / d) ** 2)) + (1.4e-12 * p * theta ** 1.5) / (1 + 1.9e-5 * f ** 1.5));
  return 0.182 * f * (sum + nD);
}

/** γ_w, dB/km (inputs already validated). */
export function waterVapourSpecificAttenuationUnchecked(f: number, p: number, t: number, rho: number): number {
  if (rho === 0) return 0;
  const theta = 300 / t;
  const e = vapourPressureHpa(rho, t);
  const theta35 = theta ** 3.5;
  let sum = 0;
  for (let i = 0; i < WATER_VAPOUR_LINES_P676_12.length; i++) {
    const row = WATER_VAPOUR_LINES_P676_12[i];
    const fi = row[0], b1 = row[1], b2 = row[2], b3 = row[3], b4 = row[4], b5 = row[5], b6 = row[6];
    const s = b1 * 1e-1 * e * theta35 * Math.exp(b2 * (1 - theta));
    let df = b3 * 1e-4 * (p * theta ** b4 + b5 * e * theta ** b6);
    df = 0.535 * df + Math.sqrt(0.217 * df * df + (2.1316e-12 * fi * fi) / theta); // eq. 6c: Doppler
    sum += s * lineShape(f, fi, df, 0);
  }
  return 0.182 * f * sum;
}

/**
 * γ_w(f)/γ_w(fRef) at one pressure, temperature and density: line strengths and widths do not
 * depend on frequency, so both sums share them (the P.676-12 Annex 2 water-vapour ratio, at half
 * the cost of two full evaluations). Inputs already validated, ρ > 0.
 */
export function waterVapourRatioUnchecked(f: number, fRef: number, p: number, t: number, rho: number): number {
  const theta = 300 / t;
  const lnTheta = Math.log(theta);
  const e = vapourPressureHpa(rho, t);
  let sum = 0;
  let sumRef = 0;
  for (let i = 0; i < WATER_VAPOUR_LINES_P676_12.length; i++) {
    const row = WATER_VAPOUR_LINES_P676_12[i];
    const fi = row[0], b1 = row[1], b2 = row[2], b3 = row[3], b4 = row[4], b5 = row[5], b6 = row[6];
    // S ∝ b1 e θ^3.5 exp(b2(1 − θ)): its common factor e θ^3.5 cancels in the ratio.
    const s = b1 * Math.exp(b2 * (1 - theta));
    let df = b3 * 1e-4 * (p * Math.exp(b4 * lnTheta) + b5 * e * Math.exp(b6 * lnTheta));
    df = 0.535 * df + Math.sqrt(0.217 * df * df + (2.1316e-12 * fi * fi) / theta);
    sum += s * lineShape(f, fi, df, 0);
    sumRef += s * lineShape(fRef, fi, df, 0);
  }
  return (f * sum) / (fRef * sumRef);
}

/** Line shape factor F_i (eq. 5), with interference δ. */
function lineShape(f: number, fi: number, df: number, delta: number): number {
  const dm = fi - f;
  const dp = fi + f;
  return (f / fi) * ((df - delta * dm) / (dm * dm + df * df) + (df - delta * dp) / (dp * dp + df * df));
}
