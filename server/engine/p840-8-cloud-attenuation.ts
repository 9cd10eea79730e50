import { EngineInputError } from './errors';
import { requireNumberInRange } from './validate';

/** Liquid water temperature of ITU-R P.840-8 §3 for the reduced cloud liquid maps, K (0 °C). */
export const CLOUD_LIQUID_TEMPERATURE_K_P840_8 = 273.15;
/** Slant paths of P.840-8: 5° ≤ θ ≤ 90° (1/sin θ). */
const MIN_ELEVATION_DEG_P840_8 = 5;
const DEG = Math.PI / 180;

/**
 * Cloud liquid water mass absorption coefficient K_l(f, T), (dB/km)/(g/m³), ITU-R P.840-8 §2:
 * the double-Debye model of the permittivity of water, K_l = 0.819 f / (ε''(1 + η²)) with
 * η = (2 + ε')/ε'', θ = 300/T, ε0 = 77.66 + 103.3(θ − 1), ε1 = 0.0671 ε0, ε2 = 3.52,
 * f_p = 20.20 − 146(θ − 1) + 316(θ − 1)², f_s = 39.8 f_p.
 *
 * Bad input: frequency outside 1–200 GHz or temperature outside 233–313 K throws EngineInputError.
 *
 * @example
 * cloudMassAbsorption({ frequencyGHz: 14.25 }) // => 0.1819… at 0 °C
 */
export function cloudMassAbsorption(options: { frequencyGHz: number; temperatureK?: number }): number {
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 1, 200, 'ITU-R P.840-8 is stated up to 200 GHz');
  const t = options.temperatureK === undefined ? CLOUD_LIQUID_TEMPERATURE_K_P840_8 : requireNumberInRange(options.temperatureK, 'temperatureK', 233, 313);
  return cloudMassAbsorptionUnchecked(f, t);
}

/** {@link cloudMassAbsorption} without validation (hot path). */
export function cloudMassAbsorptionUnchecked(f: number, t: number): number {
  const theta = 300 / t;
  const e0 = 77.66 + 103.3 * (theta - 1);
  const e1 = 0.0671 * e0;
  const e2 = 3.52;
  const fp = 20.2 - 146 * (theta - 1) + 316 * (theta - 1) ** 2;
  const fs = 39.8 * fp;
  const xp = f / fp;
  const xs = f / fs;
  const epsImag = (f * (e0 - e1)) / (fp * (1 + xp * xp)) + (f * (e1 - e2)) / (fs * (1 + xs * xs));
  const epsReal = (e0 - e1) / (1 + xp * xp) + (e1 - e2) / (1 + xs * xs) + e2;
  const eta = (2 + epsReal) / epsImag;
  return (0.819 * f) / (epsImag * (1 + eta * eta));
}

/**
 * Cloud attenuation on a slant path exceeded for the p % whose reduced cloud liquid is given,
 * dB (ITU-R P.840-8 §3): A_C = L_red K_l(f, 273.15 K) / sin θ, for 5° ≤ θ ≤ 90°.
 *
 * Bad input: frequency outside 1–200 GHz, θ outside 5–90°, L_red outside 0–20 kg/m² (or NaN)
 * throws EngineInputError naming the field.
 *
 * @example
 * cloudAttenuation({ frequencyGHz: 14.25, elevationDeg: 31.07699124, reducedCloudLiquidKgM2: 1.29 }) // => ≈ 0.455 dB
 */
export function cloudAttenuation(options: { frequencyGHz: number; elevationDeg: number; reducedCloudLiquidKgM2: number }): number {
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 1, 200, 'ITU-R P.840-8 is stated up to 200 GHz');
  const el = requireNumberInRange(options.elevationDeg, 'elevationDeg', -90, 90);
  if (el < MIN_ELEVATION_DEG_P840_8) throw new EngineInputError('elevationDeg', 'ITU-R P.840-8 slant paths are for elevations of 5° and above', el);
  const l = requireNumberInRange(options.reducedCloudLiquidKgM2, 'reducedCloudLiquidKgM2', 0, 20);
  return (l * cloudMassAbsorptionUnchecked(f, CLOUD_LIQUID_TEMPERATURE_K_P840_8)) / Math.sin(el * DEG);
}
