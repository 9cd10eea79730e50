import { requireFinite, requireNumberInRange } from './validate';

/** ITU-R P.839-4 eq. (1): mean rain height is 0.36 km above the mean 0 °C isotherm height h_0. */
export const RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4 = 0.36;

/** Where a rain height came from; the latitude rule is an approximation and is labelled so. */
export type RainHeightSource = 'given' | 'zero-isotherm' | 'latitude-approximation';

/** A rain height with its provenance. */
export interface RainHeight {
  /** Mean rain height above mean sea level h_R, km. */
  rainHeightKm: number;
  /** 0 °C isotherm height h_0 used, km (null when h_R itself was given). */
  zeroIsothermHeightKm: number | null;
  source: RainHeightSource;
}

/**
 * Rain height from the mean 0 °C isotherm height: h_R = h_0 + 0.36 km (ITU-R P.839-4 eq. (1)).
 *
 * Bad input: non-finite h_0 or h_0 outside −1…10 km throws EngineInputError('zeroIsothermHeightKm').
 *
 * @example
 * rainHeightFromIsotherm({ zeroIsothermHeightKm: 2.09273333 }) // => 2.45273333
 */
export function rainHeightFromIsotherm(options: { zeroIsothermHeightKm: number }): number {
  const h0 = requireNumberInRange(options.zeroIsothermHeightKm, 'zeroIsothermHeightKm', -1, 10);
  return h0 + RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4;
}

/** Older P.839 latitude rule: h_0 = 5 km from 23° N to 21° S (ITU-R P.839-2, from memory). */
const TROPICAL_ISOTHERM_KM_P839_2 = 5;
/** North of 23° N h_0 falls 0.075 km per degree (ITU-R P.839-2, from memory). */
const NORTH_LAPSE_KM_PER_DEG_P839_2 = 0.075;
/** South of 21° S h_0 falls 0.1 km per degree, reaching 0 at 71° S (ITU-R P.839-2, from memory). */
const SOUTH_LAPSE_KM_PER_DEG_P839_2 = 0.1;

/**
 * The 0 °C isotherm height h_0 from latitude alone, by the rule of the older editions of
 * ITU-R P.839 (server/engine/README.md §1): 5 km for 0–23° N and 0–21° S, −0.075 km/° north of 23° N,
 * −0.1 km/° south of 21° S, 0 south of 71° S (and never below 0 km in the far north).
 * This is an APPROXIMATION used only when no h_0 is known; callers must label it
 * (`source: 'latitude-approximation'`). P.839-4 itself gives h_0 from a digital map.
 *
 * Bad input: latitude outside −90…90° or non-finite throws EngineInputError('latDeg').
 *
 * @example
 * latitudeIsothermHeight({ latDeg: 51.5 }) // => 2.8625 (5 − 0.075 × 28.5)
 * latitudeIsothermHeight({ latDeg: -30 })  // => 4.1   (5 − 0.1 × 9)
 */
export function latitudeIsothermHeight(options: { latDeg: number }): number {
  const lat = requireNumberInRange(options.latDeg, 'latDeg', -90, 90);
  if (lat >= 23) return Math.max(0, TROPICAL_ISOTHERM_KM_P839_2 - NORTH_LAPSE_KM_PER_DEG_P839_2 * (lat - 23));
  if (lat >= -21) return TROPICAL_ISOTHERM_KM_P839_2;
  if (lat >= -71) return TROPICAL_ISOTHERM_KM_P839_2 - SOUTH_LAPSE_KM_PER_DEG_P839_2 * (-21 - lat);
  return 0;
}

/**
 * Resolve the rain height for a site: the given h_R, else h_0 + 0.36 km from a given h_0
 * (ITU-R P.839-4 eq. (1)), else the labelled latitude approximation + 0.36 km.
 *
 * Bad input: a given height that is non-finite or outside −1…10 km throws EngineInputError
 * naming it (`rainHeightKm` / `zeroIsothermHeightKm`).
 *
 * @example
 * resolveRainHeight({ latDeg: 51.5 })
 * // => { rainHeightKm: 3.2225, zeroIsothermHeightKm: 2.8625, source: 'latitude-approximation' }
 */
export function resolveRainHeight(options: {
  latDeg: number;
  rainHeightKm?: number;
  zeroIsothermHeightKm?: number;
  fieldPrefix?: string;
}): RainHeight {
  const prefix = options.fieldPrefix ?? '';
  if (options.rainHeightKm !== undefined) {
    const h = requireNumberInRange(options.rainHeightKm, `${prefix}rainHeightKm`, -1, 10.36);
    return { rainHeightKm: h, zeroIsothermHeightKm: null, source: 'given' };
  }
  if (options.zeroIsothermHeightKm !== undefined) {
    const h0 = requireNumberInRange(options.zeroIsothermHeightKm, `${prefix}zeroIsothermHeightKm`, -1, 10);
    return { rainHeightKm: h0 + RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4, zeroIsothermHeightKm: h0, source: 'zero-isotherm' };
  }
  requireFinite(options.latDeg, 'latDeg');
  const h0 = latitudeIsothermHeight({ latDeg: options.latDeg });
  return { rainHeightKm: h0 + RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4, zeroIsothermHeightKm: h0, source: 'latitude-approximation' };
}
