import type { TradeoffOption } from '@/server/engine/tradeoff-types';

/**
 * Whether the ACM expected throughput is worth a column: when every dish carries within 1 % of the
 * same rate (the clear-sky MODCOD holds nearly all year whatever the dish), a column of equal
 * figures tells nothing, so the screens say it once in words instead. 1 % is our reading threshold
 * (a difference a customer would not notice), not a published figure.
 */
export const ACM_SPREAD_WORTH_A_COLUMN = 0.01;

export type AcmSummary = { kind: 'none' } | { kind: 'differs' } | { kind: 'same'; minMbps: number; maxMbps: number; clearSkyModcod: string | null; upperBound: boolean };

export function acmSummary(options: readonly Pick<TradeoffOption, 'acm' | 'closes'>[]): AcmSummary {
  const withAcm = options.filter((o) => o.closes && o.acm !== null).map((o) => o.acm!);
  if (!withAcm.length) return { kind: 'none' };
  const rates = withAcm.map((a) => a.expectedThroughputMbps);
  const minMbps = Math.min(...rates);
  const maxMbps = Math.max(...rates);
  if (maxMbps > 0 && (maxMbps - minMbps) / maxMbps >= ACM_SPREAD_WORTH_A_COLUMN) return { kind: 'differs' };
  const modcods = new Set(withAcm.map((a) => a.clearSkyModcod));
  return { kind: 'same', minMbps, maxMbps, clearSkyModcod: modcods.size === 1 ? withAcm[0].clearSkyModcod : null, upperBound: withAcm.some((a) => a.modelRangeLimited) };
}
