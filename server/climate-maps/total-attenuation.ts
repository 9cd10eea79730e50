import { EngineInputError } from '../engine/errors';
import { MIN_ELEVATION_DEG_ATMOSPHERE, slantPathTotalCurve, type AttenuationComponents } from '../engine/p618-total-attenuation';
import { checkRainPathOptions, MAX_P_PERCENT_P618_14, MIN_P_PERCENT_P618_14 } from '../engine/p618-rain-path';
import { PHYSICAL_RANGES } from '../engine/physical-ranges';
import { requireNumberInRange } from '../engine/validate';
import { siteAtmosphere } from './site-atmosphere';
import { siteClimate } from './site-climate';

/** Inputs of {@link totalAttenuation}: a site, a path to a satellite, a dish and a time percentage. */
export interface TotalAttenuationOptions {
  latDeg: number;
  lonDeg: number;
  /** Station height above mean sea level, km (e.g. the P.1511-1 topographic height). */
  stationHeightKm: number;
  frequencyGHz: number;
  /** Elevation θ, degrees; gases, clouds and scintillation need θ ≥ 5°. */
  elevationDeg: number;
  /** Polarization tilt τ, degrees (0 horizontal, 90 vertical, 45 circular; P.838-3). */
  tiltDeg: number;
  /** Dish diameter, m, and aperture efficiency (scintillation averaging, P.618-14 §2.4.1 step 5). */
  diameterM: number;
  efficiency: number;
  /** Percentage of an average year, 0.001–5 % (the P.618-14 rain model range). */
  pPercent: number;
}

/**
 * Everything from the site's coordinates: the attenuation exceeded for p % of an average year
 * by each mechanism and in total (ITU-R P.618-14 §2.5), with the rain climate (P.837-7 Annex 1
 * on the P.837-7/P.1510-1 monthly maps), rain height (P.839-4), N_wet (P.453-14), water vapour
 * (P.836-6), cloud liquid (P.840-8) and temperature (P.1510-1) all read from the ITU-R maps, gases
 * by P.676-12 Annex 2 and clouds by P.840-8. Components are reported at p (gases and clouds held
 * at their 0.1 % values below 0.1 %); the total holds gases and clouds at their 1 % values for
 * p < 1 % (§2.5). This is the public contract the engine's trade-off uses through dishTradeoff's
 * `atmosphere` input.
 *
 * Bad input: a site without map data or out of range, a station height outside −0.5–9 km, θ below
 * 5°, p outside 0.001–5 % or any other bad number throws EngineInputError naming the field.
 *
 * @example
 * totalAttenuation({ latDeg: 51.5, lonDeg: -0.14, stationHeightKm: 0.031382984, frequencyGHz: 14.25,
 *   elevationDeg: 31.07699124, tiltDeg: 0, diameterM: 1, efficiency: 0.65, pPercent: 0.01 }).totalDb
 * // => 7.50726… (ITU-R SG 3 validation example, P.618-13 §2.5)
 */
export function totalAttenuation(o: TotalAttenuationOptions): AttenuationComponents {
  const el = requireNumberInRange(o.elevationDeg, 'elevationDeg', -90, 90);
  if (el < MIN_ELEVATION_DEG_ATMOSPHERE) throw new EngineInputError('elevationDeg', 'gases, clouds and scintillation (P.676-12 Annex 2, P.840-8, P.618-14 §2.4.1) are stated for elevations of 5° and above', el);
  const p = requireNumberInRange(o.pPercent, 'pPercent', MIN_P_PERCENT_P618_14, MAX_P_PERCENT_P618_14, 'the ITU-R P.618-14 rain model covers 0.001–5 %');
  const f = requireNumberInRange(o.frequencyGHz, 'frequencyGHz', 1, 55, 'ITU-R P.618-14 rain attenuation is stated for 1–55 GHz');
  const d = requireNumberInRange(o.diameterM, 'diameterM', PHYSICAL_RANGES.diameterM.min, PHYSICAL_RANGES.diameterM.max, 'physical range');
  const eta = requireNumberInRange(o.efficiency, 'efficiency', 0.01, 1);
  const climate = siteClimate({ latDeg: o.latDeg, lonDeg: o.lonDeg });
  const atmosphere = siteAtmosphere({ latDeg: o.latDeg, lonDeg: o.lonDeg, stationHeightKm: o.stationHeightKm });
  const path = { latDeg: o.latDeg, stationHeightKm: o.stationHeightKm, frequencyGHz: f, elevationDeg: el, tiltDeg: o.tiltDeg, r001MmH: climate.r001MmH, rainHeightKm: climate.rainHeightKm };
  checkRainPathOptions(path);
  return slantPathTotalCurve({ ...path, atmosphere, diameterM: d, efficiency: eta }).componentsAt(p);
}
