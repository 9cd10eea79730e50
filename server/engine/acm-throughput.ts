import type { Modcod } from './dvb-s2-modcods';
import { fadeThresholdUnchecked } from './fade-threshold';
import type { RainPath } from './p618-rain-path';

/** Share of the year spent on one MODCOD. */
export interface AcmShare {
  modcod: string;
  /** Percentage of an average year this MODCOD is the best one that closes, %. */
  sharePercent: number;
}

/** Expected ACM throughput of one dish. */
export interface AcmThroughput {
  /** Σ share × spectral efficiency × symbol rate, Mbit/s (information rate, no overheads). */
  expectedThroughputMbps: number;
  /** The MODCOD used in clear sky (null: not even the most robust one closes). */
  clearSkyModcod: string | null;
  /** Throughput in clear sky, Mbit/s (0 when nothing closes). */
  clearSkyThroughputMbps: number;
  /** Shares per MODCOD that is ever the best (most robust first), plus `'outage'` for below the lowest. */
  shares: AcmShare[];
  /**
   * True when some MODCOD's fade threshold is exceeded more than 5 % of the year (beyond the
   * P.618 model range): 5 % was used for that step, so the expected throughput is an upper
   * bound. (Thresholds exceeded less than 0.001 % use 0.001 %: an error below 0.001 % of the
   * throughput, not flagged.)
   */
  modelRangeLimited: boolean;
}

/**
 * The MODCODs that are ever "the best one that closes": sorted by Es/N0 threshold, keeping only
 * those whose efficiency beats every more robust one (a MODCOD needing more Es/N0 for less
 * throughput is never chosen). Engine step of server/engine/README.md §4 "ACM carriers".
 *
 * Bad input: none here (callers validated the MODCODs); an empty list gives an empty envelope.
 *
 * @example
 * acmEnvelope(DVB_S2_MODCODS).map((m) => m.name).includes('QPSK 8/9') // => false (8PSK 3/5 beats it)
 */
export function acmEnvelope(modcods: readonly Modcod[]): Modcod[] {
  const sorted = [...modcods].sort((a, b) => a.idealEsN0Db - b.idealEsN0Db || b.spectralEfficiencyBitPerSymbol - a.spectralEfficiencyBitPerSymbol);
  const envelope: Modcod[] = [];
  let best = -Infinity;
  for (const m of sorted) {
    if (m.spectralEfficiencyBitPerSymbol > best) {
      envelope.push(m);
      best = m.spectralEfficiencyBitPerSymbol;
    }
  }
  return envelope;
}

/**
 * Expected ACM throughput of one dish over a MODCOD set (server/engine/README.md §4): for each MODCOD of the
 * envelope, its fade threshold A*_j (clear-sky margin over ideal Es/N0 + implementation margin,
 * with the noise increase of rain) and the exceedance q_j = P(A > A*_j) from ITU-R P.618-14;
 * the top MODCOD gets 100 − q_top % of the year, each lower one q_{j+1} − q_j, and the
 * remaining q_lowest % is outage.
 *
 * Bad input: callers pass validated numbers (this is the trade-off's hot path); a MODCOD that
 * does not close in clear sky simply gets no share.
 *
 * @example
 * // envelope of QPSK 3/4, 8PSK 3/4, 16APSK 3/4; rainPath = prepareRainPath(site V8 at 14.25 GHz)
 * acmThroughput({ envelope, clearSkyEsN0Db: 14, symbolRateMsps: 30, implementationMarginDb: 1,
 *   rainPath, lnbNoiseTempK: 50, antennaNoiseTempK: 30, mediumTempK: 275 })
 * // => { expectedThroughputMbps: 88.86…, clearSkyModcod: '16APSK 3/4', clearSkyThroughputMbps: 89.00…,
 * //      shares: [outage 0.0276 %, QPSK 3/4 0.100 %, 8PSK 3/4 0.316 %, 16APSK 3/4 99.556 %], modelRangeLimited: false }
 */
export function acmThroughput(o: {
  envelope: readonly Modcod[];
  clearSkyEsN0Db: number;
  symbolRateMsps: number;
  implementationMarginDb: number;
  /** The path's exceedance: rain alone (prepareRainPath) or the P.618-14 §2.5 total (totalAttenuationCurve). */
  rainPath: Pick<RainPath, 'exceedanceOf'>;
  lnbNoiseTempK: number;
  antennaNoiseTempK: number;
  mediumTempK: number;
}): AcmThroughput {
  const n = o.envelope.length;
  const q: number[] = new Array(n);
  let limited = false;
  for (let j = 0; j < n; j++) {
    const margin = o.clearSkyEsN0Db - o.envelope[j].idealEsN0Db - o.implementationMarginDb;
    const a = fadeThresholdUnchecked(margin, o.lnbNoiseTempK, o.antennaNoiseTempK, o.mediumTempK);
    if (a === null) {
      q[j] = 100;
      continue;
    }
    const ex = o.rainPath.exceedanceOf(a);
    if (ex.bound === 'above-model-range') limited = true;
    q[j] = ex.pPercent;
  }
  const shares: AcmShare[] = [];
  let throughput = 0;
  let clearSky: Modcod | null = null;
  for (let j = 0; j < n; j++) {
    const upper = j + 1 < n ? q[j + 1] : 100;
    const share = Math.max(0, upper - q[j]);
    if (q[j] < 100) clearSky = o.envelope[j];
    if (share > 0) {
      shares.push({ modcod: o.envelope[j].name, sharePercent: share });
      throughput += (share / 100) * o.envelope[j].spectralEfficiencyBitPerSymbol * o.symbolRateMsps;
    }
  }
  shares.unshift({ modcod: 'outage', sharePercent: n > 0 ? q[0] : 100 });
  return {
    expectedThroughputMbps: throughput,
    clearSkyModcod: clearSky ? clearSky.name : null,
    clearSkyThroughputMbps: clearSky ? clearSky.spectralEfficiencyBitPerSymbol * o.symbolRateMsps : 0,
    shares,
    modelRangeLimited: limited,
  };
}
