import { PHYSICAL_RANGES } from './physical-ranges';
import { BOLTZMANN_DB } from './physical-constants';
import { requireFinite, requireNonNegative, requireNumberInRange } from './validate';

/** Options of {@link linkBudget}: one hop, clear sky. */
export interface LinkBudgetOptions {
  /** EIRP toward the receiver, dBW. */
  eirpDbw: number;
  /** Free-space loss of the hop, dB (see freeSpaceLoss). */
  freeSpaceLossDb: number;
  /** Other clear-sky losses (gases, pointing, radome…), dB; 0 if omitted. */
  otherLossesDb?: number;
  /** Receiver figure of merit G/T, dB/K. */
  gOverTDbK: number;
  /** Symbol rate R_s, Msymbol/s. */
  symbolRateMsps: number;
  /** Es/N0 the MODCOD needs, dB (e.g. DVB-S2 ideal AWGN threshold). */
  requiredEsN0Db: number;
  /** Margin for a real modem over the ideal threshold, dB; 0 if omitted. */
  implementationMarginDb?: number;
}

/** Clear-sky result of one hop. */
export interface LinkBudget {
  /** Carrier-to-noise-density ratio, dB·Hz. */
  cOverN0DbHz: number;
  /** Symbol energy to noise density, dB. */
  esN0Db: number;
  /** Clear-sky margin Es/N0 − (required + implementation margin), dB; ≤ 0 means it does not close. */
  marginDb: number;
}

/**
 * Clear-sky link budget of one hop (server/engine/README.md §4): C/N0 = EIRP − L_fs − L_other + G/T + 228.6 dB·Hz;
 * Es/N0 = C/N0 − 10 log10(R_s); margin = Es/N0 − (required Es/N0 + implementation margin).
 *
 * Bad input: NaN anywhere, a symbol rate ≤ 0, or negative losses/implementation margin throws
 * EngineInputError naming the field. A negative margin is returned as is (it is the shortfall);
 * callers call such a link "does not close".
 *
 * @example
 * linkBudget({ eirpDbw: 52, freeSpaceLossDb: 205.6, gOverTDbK: 19.1, symbolRateMsps: 30, requiredEsN0Db: 7.91, implementationMarginDb: 1 })
 * // => { cOverN0DbHz: 94.1, esN0Db: 19.328…, marginDb: 10.418… }
 */
export function linkBudget(options: LinkBudgetOptions): LinkBudget {
  const eirp = requireNumberInRange(options.eirpDbw, 'eirpDbw', PHYSICAL_RANGES.eirpDbw.min, PHYSICAL_RANGES.eirpDbw.max, 'physical range');
  const fsl = requireFinite(options.freeSpaceLossDb, 'freeSpaceLossDb');
  const other = options.otherLossesDb === undefined ? 0 : requireNonNegative(options.otherLossesDb, 'otherLossesDb');
  const gt = requireFinite(options.gOverTDbK, 'gOverTDbK');
  const rs = requireNumberInRange(options.symbolRateMsps, 'symbolRateMsps', PHYSICAL_RANGES.symbolRateMsps.min, PHYSICAL_RANGES.symbolRateMsps.max, 'physical range');
  const req = requireNumberInRange(options.requiredEsN0Db, 'requiredEsN0Db', PHYSICAL_RANGES.esN0Db.min, PHYSICAL_RANGES.esN0Db.max, 'physical range');
  const impl = options.implementationMarginDb === undefined ? 0 : requireNonNegative(options.implementationMarginDb, 'implementationMarginDb');
  return linkBudgetUnchecked(eirp, fsl + other, gt, rs, req + impl);
}

/** {@link linkBudget} without validation (hot path); `totalLossDb` = L_fs + L_other, `thresholdDb` = required + implementation. */
export function linkBudgetUnchecked(eirpDbw: number, totalLossDb: number, gOverTDbK: number, symbolRateMsps: number, thresholdDb: number): LinkBudget {
  const cOverN0DbHz = eirpDbw - totalLossDb + gOverTDbK + BOLTZMANN_DB;
  const esN0Db = cOverN0DbHz - 10 * Math.log10(symbolRateMsps * 1e6);
  return { cOverN0DbHz, esN0Db, marginDb: esN0Db - thresholdDb };
}
