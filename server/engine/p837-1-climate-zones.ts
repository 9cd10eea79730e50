import { EngineInputError } from './errors';
import { requireNumberInRange } from './validate';

/** ITU-R P.837-1 rain climate zone letters (there is no zone I or O). */
export type ClimateZone = 'A' | 'B' | 'C' | 'D' | 'E' | 'F' | 'G' | 'H' | 'J' | 'K' | 'L' | 'M' | 'N' | 'P' | 'Q';

/** Percentages of an average year at which ITU-R P.837-1 tabulates rain rates. */
export const CLIMATE_ZONE_P_PERCENT_P837_1: readonly number[] = [1, 0.3, 0.1, 0.03, 0.01, 0.003, 0.001];

/**
 * Rain rate (mm/h) exceeded for 1, 0.3, 0.1, 0.03, 0.01, 0.003 and 0.001 % of an average year
 * per zone. Source: Rec. ITU-R P.837-1 (1994), Table 1 — typed from memory (as the reference
 * file itu-p837-1-climate-zones.csv also is); the unit tests check every row against it.
 */
export const CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1: Readonly<Record<ClimateZone, readonly number[]>> = {
  A: [0.1, 0.8, 2, 5, 8, 14, 22],
  B: [0.5, 2, 3, 6, 12, 21, 32],
  C: [0.7, 2.8, 5, 9, 15, 26, 42],
  D: [2.1, 4.5, 8, 13, 19, 29, 42],
  E: [0.6, 2.4, 6, 12, 22, 41, 70],
  F: [1.7, 4.5, 8, 15, 28, 54, 78],
  G: [3, 7, 12, 20, 30, 45, 65],
  H: [2, 4, 10, 18, 32, 55, 83],
  J: [8, 13, 20, 28, 35, 45, 55],
  K: [1.5, 4.2, 12, 23, 42, 70, 100],
  L: [2, 7, 15, 33, 60, 105, 150],
  M: [4, 11, 22, 40, 63, 95, 120],
  N: [5, 15, 35, 65, 95, 140, 180],
  P: [12, 34, 65, 105, 145, 200, 250],
  Q: [24, 49, 72, 96, 115, 142, 170],
};

/** All zone letters in table order. */
export const CLIMATE_ZONES: readonly ClimateZone[] = Object.keys(CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1) as ClimateZone[];

/** True when `zone` is one of the ITU-R P.837-1 letters. */
export function isClimateZone(zone: unknown): zone is ClimateZone {
  return typeof zone === 'string' && Object.prototype.hasOwnProperty.call(CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1, zone);
}

/**
 * Rain rate exceeded for p % of an average year in an ITU-R P.837-1 climate zone, mm/h:
 * the tabulated value at a tabulated p, otherwise linear interpolation of log R against log p
 * between the two neighbouring tabulated points (server/engine/README.md §1, source 4). No extrapolation:
 * p outside 0.001–1 % is refused.
 *
 * Bad input: an unknown zone letter, NaN, or p outside 0.001–1 % throws EngineInputError
 * (`field` defaults to `'climateZone'` / `'pPercent'`).
 *
 * @example
 * climateZoneRainRate({ zone: 'K', pPercent: 0.01 }) // => 42
 * climateZoneRainRate({ zone: 'K', pPercent: 0.02 }) // => 28.72… (between 42 @ 0.01 % and 23 @ 0.03 %)
 */
export function climateZoneRainRate(options: { zone: ClimateZone; pPercent: number; field?: string }): number {
  const field = options.field ?? 'climateZone';
  if (!isClimateZone(options.zone)) {
    throw new EngineInputError(field, `must be an ITU-R P.837-1 zone letter A–H, J–N, P or Q; got ${String(options.zone)}`, options.zone);
  }
  const p = requireNumberInRange(options.pPercent, 'pPercent', 0.001, 1, 'ITU-R P.837-1 tabulates 0.001–1 %');
  const rates = CLIMATE_ZONE_RAIN_RATES_MM_H_P837_1[options.zone];
  const ps = CLIMATE_ZONE_P_PERCENT_P837_1;
  for (let i = 0; i < ps.length - 1; i++) {
    const pHigh = ps[i];
    const pLow = ps[i + 1];
    if (p === pHigh) return rates[i];
    if (p > pLow) {
      const t = Math.log(p / pHigh) / Math.log(pLow / pHigh);
      return Math.exp(Math.log(rates[i]) + t * Math.log(rates[i + 1] / rates[i]));
    }
  }
  return rates[ps.length - 1];
}
