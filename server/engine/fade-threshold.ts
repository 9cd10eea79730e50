import { checkSystemNoise, type SystemNoiseOptions } from './system-noise';
import { requireFinite } from './validate';

/**
 * Fade threshold A*, dB: the rain attenuation at which the downlink degradation
 * DND(A) = A + 10 log10(T_sys(A)/T_sys(0)) uses up the clear-sky margin M (server/engine/README.md §4).
 * DND is strictly increasing when T_rx > 0, so A* is unique; instead of bisecting, the engine
 * solves it exactly: with x = 10^(−A/10), T_sys(A) = (T_rx + T_m) + (T_ant − T_m) x, and
 * DND(A*) = M gives x* = (T_rx + T_m)/(10^(M/10) T_sys(0) − T_ant + T_m), A* = −10 log10 x*.
 * For the uplink (no receiver at the site) pass `noiseIncrease: false`: then A* = M.
 *
 * Bad input: a margin ≤ 0 means the link does not close in clear sky and has no fade threshold:
 * returns `null`, never a negative number. NaN or bad temperatures throw EngineInputError.
 *
 * @example
 * fadeThreshold({ marginDb: 7.0271076884711565, lnbNoiseTempK: 50, antennaNoiseTempK: 30 }) // => 3.000… dB
 */
export function fadeThreshold(options: SystemNoiseOptions & { marginDb: number; noiseIncrease?: boolean }): number | null {
  const m = requireFinite(options.marginDb, 'marginDb');
  if (options.noiseIncrease === false) return m > 0 ? m : null;
  const t = checkSystemNoise(options);
  return fadeThresholdUnchecked(m, t.lnb, t.ant, t.medium);
}

/** Downlink A* without validation (hot path); null when the margin is not positive. */
export function fadeThresholdUnchecked(marginDb: number, lnbK: number, antennaK: number, mediumK: number): number | null {
  if (!(marginDb > 0)) return null;
  const tSys0 = lnbK + antennaK;
  const x = (lnbK + mediumK) / (10 ** (marginDb / 10) * tSys0 - antennaK + mediumK);
  return -10 * Math.log10(x);
}
