import { EngineInputError } from './errors';
import { oxygenSpecificAttenuationUnchecked, vapourPressureHpa, waterVapourRatioUnchecked } from './p676-12-specific-attenuation';
import { requireNumberInRange } from './validate';

/*
 * Slant-path gaseous attenuation, ITU-R P.676-12 Annex 2 ("approximate estimation of gaseous
 * attenuation in the frequency range 1–350 GHz"), as used by P.618-13 §2.5 for A_G(p).
 *
 * Where the equations come from: the Annex 2 text itself was not at hand when this file was
 * written (the stored copies of the Recommendation held only its front matter). The equations
 * below are the published ones as remembered, and each was then checked against every row of
 * the ITU-R SG 3 validation examples (itu-p676-12-gas-attenuation.csv): the largest relative
 * error is 2.2e-6. What remains is a systematic +5.7e-6 in the oxygen term that grows with r_p
 * like exp(2.12 r_p), i.e. like the t2 term of h_o: one c_i of the t2 table (or one more line in
 * it) is probably slightly different in the published table. Nothing was fitted to the figures.
 */

/** Inputs of {@link gasSlantPathAttenuation}: the station's surface climate and the path. */
export interface GasSlantPathOptions {
  /** Frequency f, GHz; Annex 2 is written for 1–350 GHz. */
  frequencyGHz: number;
  /** Elevation θ, degrees; Annex 2 slant paths use 1/sin θ, stated for θ ≥ 5°. */
  elevationDeg: number;
  /** Surface (dry-air) pressure p, hPa, e.g. the ITU-R P.835 reference atmosphere at the station height. */
  pressureHpa: number;
  /** Surface temperature T, K: the annual mean surface temperature of ITU-R P.1510-1. */
  temperatureK: number;
  /** Surface water-vapour density ρ, g/m³ (ITU-R P.836-6): enters γ_o and r_p only. */
  surfaceVapourDensityGM3: number;
  /** Integrated water-vapour content V_t, kg/m² (ITU-R P.836-6): sets the water-vapour term. */
  waterVapourContentKgM2: number;
  /** Station height above mean sea level h_s, km: scales the water-vapour term above 20 GHz. */
  stationHeightKm: number;
}

/** Zenith-scaled slant-path attenuation by each gas, dB. */
export interface GasSlantPathAttenuation {
  /** A_o: dry air (oxygen lines and dry continuum), dB. */
  oxygenDb: number;
  /** A_w: water vapour, from the integrated content V_t, dB. */
  waterVapourDb: number;
  /** A_o + A_w, dB. */
  totalDb: number;
}

const DEG = Math.PI / 180;
/** Reference pressure of the whole-column water-vapour ratio, hPa (P.676-12 Annex 2, V_t method). */
const WATER_REF_PRESSURE_HPA = 845;
/** Reference frequency of that ratio, GHz. */
const WATER_REF_FREQUENCY_GHZ = 20.6;
/** Scale height turning V_t into the reference density ρ_v,ref = V_t/2.38, km. */
const WATER_REF_SCALE_KM = 2.38;
/** Zenith attenuation per kg/m² of water vapour at the reference frequency, dB/(kg/m²). */
const WATER_ZENITH_DB_PER_KG_M2 = 0.0176;
/** Above this frequency the station-height factor (a h_s^b + 1) applies, GHz. */
const WATER_HEIGHT_FACTOR_ABOVE_GHZ = 20;
/**
 * Smallest non-zero V_t accepted, kg/m²: below about 3e-8 kg/m² the reference temperature
 * t_ref = 14 ln(0.22 V_t/2.38) + 3 °C falls below absolute zero and γ_w is undefined. Real
 * columns (ITU-R P.836 maps) are never below ~0.3 kg/m²; V_t = 0 itself is the dry limit.
 */
const MIN_NONZERO_WATER_CONTENT_KG_M2 = 1e-6;

/**
 * Oxygen lines above the 60 GHz complex that shape the oxygen equivalent height (term t2 of
 * h_o): [f_i GHz, c_i], P.676-12 Annex 2 table for t2.
 */
const OXYGEN_T2_LINES_P676_12: readonly (readonly [number, number])[] = [
  [118.750343, 0.1597],
  [368.4983, 0.1066],
  [424.76302, 0.1325],
  [487.24937, 0.042],
  [715.3929, 0.0382],
  [773.8387, 0.0915],
  [834.14533, 0.0719],
];

/**
 * Slant-path attenuation by oxygen and water vapour for an Earth station, ITU-R P.676-12 Annex 2:
 *
 * Oxygen: A_o = (0.7832 + 0.00709 (T − 273.15)) · γ_o(f, p, T, ρ) · h_o / sin θ, with γ_o the
 * Annex 1 line-by-line dry-air specific attenuation at the surface (e = ρT/216.7) and the
 * equivalent height h_o = 6.1/(1 + 0.17 r_p^−1.1) · (1 + t1 + t2 + t3) km, r_p = (p + e)/1013.25,
 *   t1 = 5.1040/(1 + 0.066 r_p^−2.3) · exp(−[(f − 59.7)/(2.87 + 12.4 exp(−7.9 r_p))]²),
 *   t2 = Σ_i c_i exp(2.12 r_p)/((f − f_i)² + 0.025 exp(2.2 r_p))   (7 lines, 118.75–834.15 GHz),
 *   t3 = 0.0114 f/(1 + 0.14 r_p^−2.6) · (15.02 f² − 1353 f + 5.333e4)/(f³ − 151.3 f² + 9629 f − 6803),
 * and h_o ≤ 10.7 r_p^0.3 km below 70 GHz (the cap P.676 puts on the 60 GHz band).
 *
 * Water vapour, from the integrated content V_t (not from ρ):
 * A_w = 0.0176 V_t · γ_w(f, 845, ρ_ref, t_ref)/γ_w(20.6, 845, ρ_ref, t_ref) · K / sin θ, with
 * ρ_ref = V_t/2.38 g/m³, t_ref = 14 ln(0.22 V_t/2.38) + 3 °C, K = 1 for f ≤ 20 GHz and
 * K = a h_s^b + 1 above, a = 0.2048 exp(−[(f − 22.43)/3.097]²) + 0.2326 exp(−[(f − 183.5)/4.096]²)
 * + 0.2073 exp(−[(f − 325)/3.651]²) − 0.1113, b = 8.741e4 exp(−0.587 f) + 312.2 f^−2.38 + 0.723.
 *
 * Why these two halves differ: V_t sums the whole column, so the water term needs no equivalent
 * height; oxygen is well mixed, so the surface γ_o times a pressure-dependent height (made
 * warmer-is-thicker by the linear temperature factor) gives its column.
 *
 * Bad input throws EngineInputError naming the field: frequency outside 1–350 GHz, elevation
 * outside 5–90°, pressure outside 300–1100 hPa, temperature outside 200–350 K (the factor
 * 0.7832 + 0.00709 (T − 273.15) would reach zero at 162.6 K), ρ outside 0–60 g/m³, V_t outside
 * 0–100 kg/m² (or 0 < V_t < 1e-6, where t_ref is below absolute zero), station height outside 0–10 km.
 *
 * @example
 * gasSlantPathAttenuation({ frequencyGHz: 14.25, elevationDeg: 46.35969261, pressureHpa: 1013.25,
 *   temperatureK: 293.3696795, surfaceVapourDensityGM3: 22.73000178, waterVapourContentKgM2: 37.95559991,
 *   stationHeightKm: 0 })
 * // => { oxygenDb: 0.064093…, waterVapourDb: 0.111917…, totalDb: 0.1760111… }
 * //    (ITU-R SG 3 validation example, Rec. ITU-R P.676-12: 0.176011463 dB)
 */
export function gasSlantPathAttenuation(options: GasSlantPathOptions): GasSlantPathAttenuation {
  const f = requireNumberInRange(options.frequencyGHz, 'frequencyGHz', 1, 350, 'ITU-R P.676-12 Annex 2 covers 1–350 GHz');
  const el = requireNumberInRange(options.elevationDeg, 'elevationDeg', 5, 90, 'Annex 2 slant paths use 1/sin θ, stated for θ ≥ 5°');
  const p = requireNumberInRange(options.pressureHpa, 'pressureHpa', 300, 1100);
  const t = requireNumberInRange(options.temperatureK, 'temperatureK', 200, 350, 'surface annual mean temperatures; the Annex 2 temperature factor vanishes at 162.6 K');
  const rho = requireNumberInRange(options.surfaceVapourDensityGM3, 'surfaceVapourDensityGM3', 0, 60);
  const v = requireNumberInRange(options.waterVapourContentKgM2, 'waterVapourContentKgM2', 0, 100);
  if (v > 0 && v < MIN_NONZERO_WATER_CONTENT_KG_M2) {
    throw new EngineInputError(
      'waterVapourContentKgM2',
      `must be 0 or at least ${MIN_NONZERO_WATER_CONTENT_KG_M2} kg/m² (t_ref = 14 ln(0.22 V_t/2.38) + 3 °C is below absolute zero for smaller V_t); got ${v}`,
      v,
    );
  }
  const hs = requireNumberInRange(options.stationHeightKm, 'stationHeightKm', 0, 10, 'Annex 2 equivalent heights are stated from sea level to about 10 km');
  return gasSlantPathAttenuationUnchecked(f, el, p, t, rho, v, hs);
}

/** {@link gasSlantPathAttenuation} without input checks, for hot paths (inputs already validated). */
export function gasSlantPathAttenuationUnchecked(
  frequencyGHz: number,
  elevationDeg: number,
  pressureHpa: number,
  temperatureK: number,
  surfaceVapourDensityGM3: number,
  waterVapourContentKgM2: number,
  stationHeightKm: number,
): GasSlantPathAttenuation {
  const sinEl = Math.sin(elevationDeg * DEG);
  const oxygenDb = oxygenZenithAttenuationDbUnchecked(frequencyGHz, pressureHpa, temperatureK, surfaceVapourDensityGM3) / sinEl;
  const waterVapourDb = waterVapourZenithAttenuationDbUnchecked(frequencyGHz, waterVapourContentKgM2, stationHeightKm) / sinEl;
  return { oxygenDb, waterVapourDb, totalDb: oxygenDb + waterVapourDb };
}

/**
 * Zenith oxygen attenuation (0.7832 + 0.00709 (T − 273.15)) γ_o h_o, dB (P.676-12 Annex 2).
 * Inputs already validated; p is the dry-air pressure, as in Annex 1.
 */
export function oxygenZenithAttenuationDbUnchecked(frequencyGHz: number, pressureHpa: number, temperatureK: number, vapourDensityGM3: number): number {
  const e = vapourPressureHpa(vapourDensityGM3, temperatureK);
  const rp = (pressureHpa + e) / 1013.25; // total pressure relative to the standard sea-level value
  const gammaO = oxygenSpecificAttenuationUnchecked(frequencyGHz, pressureHpa, temperatureK, vapourDensityGM3);
  // A warmer surface means a thicker (higher scale height) oxygen column for the same γ_o.
  const temperatureFactor = 0.7832 + 0.00709 * (temperatureK - 273.15);
  return temperatureFactor * gammaO * oxygenEquivalentHeightKm(frequencyGHz, rp);
}

/**
 * Oxygen equivalent height h_o, km (P.676-12 Annex 2): 6.1/(1 + 0.17 r_p^−1.1) (1 + t1 + t2 + t3),
 * capped at 10.7 r_p^0.3 below 70 GHz. r_p = (p + e)/1013.25.
 */
export function oxygenEquivalentHeightKm(frequencyGHz: number, rp: number): number {
  const f = frequencyGHz;
  // t1: the 60 GHz band, where absorption comes from higher, thinner air.
  const t1 = (5.104 / (1 + 0.066 * rp ** -2.3)) * Math.exp(-(((f - 59.7) / (2.87 + 12.4 * Math.exp(-7.9 * rp))) ** 2));
  // t2: the isolated lines from 118.75 GHz up, same reason.
  let t2 = 0;
  const num = Math.exp(2.12 * rp);
  const width = 0.025 * Math.exp(2.2 * rp);
  for (let i = 0; i < OXYGEN_T2_LINES_P676_12.length; i++) t2 += (OXYGEN_T2_LINES_P676_12[i][1] * num) / ((f - OXYGEN_T2_LINES_P676_12[i][0]) ** 2 + width);
  // t3: the slow frequency trend between the line bands.
  const t3 = ((0.0114 * f) / (1 + 0.14 * rp ** -2.6)) * ((15.02 * f * f - 1353 * f + 5.333e4) / (f * f * f - 151.3 * f * f + 9629 * f - 6803));
  const h = (6.1 / (1 + 0.17 * rp ** -1.1)) * (1 + t1 + t2 + t3);
  return f < 70 ? Math.min(h, 10.7 * rp ** 0.3) : h;
}

/**
 * Zenith water-vapour attenuation from the integrated content V_t, dB (P.676-12 Annex 2):
 * 0.0176 V_t γ_w(f, 845, ρ_ref, t_ref)/γ_w(20.6, 845, ρ_ref, t_ref), times (a h_s^b + 1) above 20 GHz.
 * V_t = 0 gives exactly 0 (the dry limit; the ratio itself is 0/0 there).
 */
export function waterVapourZenithAttenuationDbUnchecked(frequencyGHz: number, waterVapourContentKgM2: number, stationHeightKm: number): number {
  const v = waterVapourContentKgM2;
  if (v === 0) return 0;
  const rhoRef = v / WATER_REF_SCALE_KM;
  const tRefK = 14 * Math.log((0.22 * v) / WATER_REF_SCALE_KM) + 3 + 273.15;
  const ratio = waterVapourRatioUnchecked(frequencyGHz, WATER_REF_FREQUENCY_GHZ, WATER_REF_PRESSURE_HPA, tRefK, rhoRef);
  return WATER_ZENITH_DB_PER_KG_M2 * v * ratio * waterStationHeightFactor(frequencyGHz, stationHeightKm);
}

/**
 * K = a h_s^b + 1 above 20 GHz, 1 at and below (P.676-12 Annex 2): a raised station sees less
 * of the line-broadened lower air. a(20 GHz) ≈ 0, so K is continuous there.
 */
function waterStationHeightFactor(frequencyGHz: number, stationHeightKm: number): number {
  const f = frequencyGHz;
  if (f <= WATER_HEIGHT_FACTOR_ABOVE_GHZ) return 1;
  const a =
    0.2048 * Math.exp(-(((f - 22.43) / 3.097) ** 2)) +
    0.2326 * Math.exp(-(((f - 183.5) / 4.096) ** 2)) +
    0.2073 * Math.exp(-(((f - 325) / 3.651) ** 2)) -
    0.1113;
  const b = 8.741e4 * Math.exp(-0.587 * f) + 312.2 * f ** -2.38 + 0.723;
  return a * stationHeightKm ** b + 1;
}
