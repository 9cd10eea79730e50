import { PHYSICAL_RANGES as R } from './physical-ranges';
import { requireNonNegative, requireNumberInRange } from './validate';

/** Mean radiating temperature of rain, K (server/engine/README.md §4; common practice, no source). */
export const MEDIUM_TEMPERATURE_K_DEFAULT = 275;

/** Receiving-system temperatures, K. */
export interface SystemNoiseOptions {
  /** Receiver (LNB) noise temperature T_rx, K (> 0). */
  lnbNoiseTempK: number;
  /** Clear-sky antenna noise temperature T_ant, K. */
  antennaNoiseTempK: number;
  /** Mean radiating temperature of the rain T_m, K; 275 K if omitted (common practice). */
  mediumTempK?: number;
}

/**
 * System noise temperature with attenuation A on the path, K (server/engine/README.md §4):
 * T_sys(A) = T_rx + T_ant 10^(−A/10) + T_m (1 − 10^(−A/10)).
 *
 * Bad input: T_rx ≤ 0, negative T_ant/T_m/A or NaN throws EngineInputError naming the field.
 *
 * @example
 * systemNoiseTemperature({ lnbNoiseTempK: 50, antennaNoiseTempK: 30, attenuationDb: 3 }) // => 202.2… K
 */
export function systemNoiseTemperature(options: SystemNoiseOptions & { attenuationDb: number }): number {
  const t = checkSystemNoise(options);
  const a = requireNonNegative(options.attenuationDb, 'attenuationDb');
  return systemNoiseUnchecked(t.lnb, t.ant, t.medium, a);
}

/**
 * Downlink degradation DND(A) = A + 10 log10(T_sys(A)/T_sys(0)), dB (server/engine/README.md §4): the drop
 * in C/N (and Es/N0) caused by attenuation A, counting the extra sky noise of the rain.
 *
 * Bad input: as {@link systemNoiseTemperature}.
 *
 * @example
 * downlinkDegradation({ lnbNoiseTempK: 50, antennaNoiseTempK: 30, attenuationDb: 3 }) // => 7.027… dB
 */
export function downlinkDegradation(options: SystemNoiseOptions & { attenuationDb: number }): number {
  const t = checkSystemNoise(options);
  const a = requireNonNegative(options.attenuationDb, 'attenuationDb');
  return a + 10 * Math.log10(systemNoiseUnchecked(t.lnb, t.ant, t.medium, a) / (t.lnb + t.ant));
}

/** Validated temperatures (field names as in the trade-off's `receiver`). */
export function checkSystemNoise(o: SystemNoiseOptions, prefix = ''): { lnb: number; ant: number; medium: number } {
  return {
    lnb: requireNumberInRange(o.lnbNoiseTempK, `${prefix}lnbNoiseTempK`, R.lnbNoiseTempK.min, R.lnbNoiseTempK.max, 'physical range'),
    ant: requireNumberInRange(o.antennaNoiseTempK, `${prefix}antennaNoiseTempK`, R.antennaNoiseTempK.min, R.antennaNoiseTempK.max, 'physical range'),
    medium: o.mediumTempK === undefined ? MEDIUM_TEMPERATURE_K_DEFAULT : requireNumberInRange(o.mediumTempK, `${prefix}mediumTempK`, R.mediumTempK.min, R.mediumTempK.max, 'physical range'),
  };
}

/** T_sys(A) without validation (hot path). */
export function systemNoiseUnchecked(lnbK: number, antennaK: number, mediumK: number, attenuationDb: number): number {
  const x = 10 ** (-attenuationDb / 10);
  return lnbK + antennaK * x + mediumK * (1 - x);
}
