import type Decimal from 'decimal.js';
import type { OutageFigures } from './outage-figures';
import type { TradeoffRecommendation } from './tradeoff-types';

/** Share of the largest possible saving that marks the point of diminishing returns (engine convention; common practice, no source). */
export const DIMINISHING_RETURNS_SHARE = 0.9;

/**
 * Whether an outage is known to meet a target availability. Convention: a dish that does not
 * close, or whose outage is above the model range (> 5 %), never meets a target; below the
 * model range the availability is a lower bound (> 99.999 %), so it meets any target ≤ 99.999.
 *
 * @example
 * meetsTargetAvailability(outageFigures(0.05, 'none'), 99.9) // => true
 */
export function meetsTargetAvailability(figures: OutageFigures, targetPercent: number): boolean {
  if (figures.outageBound === 'above-model-range') return false;
  return figures.availabilityPercent >= targetPercent;
}

/**
 * The recommendation of server/engine/README.md §5, over dishes given in any order:
 * - baseline: the smallest diameter (first on ties); minutes and costs count against it;
 * - smallest meeting the target: smallest diameter whose availability is known to meet it
 *   (ties: lower price, then input order); null without a target or when none meets it;
 * - best value: the lowest cost per minute saved (ties: smaller dish); null without prices;
 * - diminishing returns: the smallest dish that already saves ≥ 90 % of the largest saving any
 *   dish offers (engine convention, no source) — beyond it each step buys little; the baseline
 *   when no dish saves anything.
 *
 * Bad input: callers pass engine-made figures; nothing is validated here.
 *
 * @example
 * tradeoffRecommendation({ basis: 'downlink', diametersM: [0.6, 0.9, 1.2], baselineIndex: 0, target: 99.9,
 *   figures: [0.3, 0.05, 0.004].map((p) => outageFigures(p, 'none')), minutesSaved: [0, 1450, 1557],
 *   prices: [d(200), d(260), d(400)], costPerMinute: [null, d(0.0456), d(0.1285)] })
 * // => { basis: 'downlink', targetAvailabilityPercent: 99.9, baselineIndex: 0,
 * //      smallestMeetingTargetIndex: 1, bestValueIndex: 1, diminishingReturnsIndex: 1 }
 */
export function tradeoffRecommendation(o: {
  basis: 'downlink' | 'two-way';
  diametersM: readonly number[];
  figures: readonly OutageFigures[];
  prices: readonly (Decimal | null)[];
  costPerMinute: readonly (Decimal | null)[];
  minutesSaved: readonly number[];
  target: number | null;
  baselineIndex: number;
}): TradeoffRecommendation {
  const n = o.diametersM.length;
  const bySize = Array.from({ length: n }, (_, i) => i).sort((a, b) => o.diametersM[a] - o.diametersM[b] || a - b);

  let smallestMeeting: number | null = null;
  if (o.target !== null) {
    for (const i of bySize) {
      if (!meetsTargetAvailability(o.figures[i], o.target)) continue;
      if (smallestMeeting === null) {
        smallestMeeting = i;
        continue;
      }
      if (o.diametersM[i] !== o.diametersM[smallestMeeting]) break;
      const pi = o.prices[i];
      const ps = o.prices[smallestMeeting];
      if (pi && ps && pi.lessThan(ps)) smallestMeeting = i;
    }
  }

  let bestValue: number | null = null;
  for (const i of bySize) {
    const c = o.costPerMinute[i];
    if (!c) continue;
    const best = bestValue === null ? null : o.costPerMinute[bestValue];
    if (best === null || best === undefined || c.lessThan(best)) bestValue = i;
  }

  const maxSaved = Math.max(...o.minutesSaved);
  let diminishing = o.baselineIndex;
  if (maxSaved > 0) {
    for (const i of bySize) {
      if (o.minutesSaved[i] >= DIMINISHING_RETURNS_SHARE * maxSaved) {
        diminishing = i;
        break;
      }
    }
  }

  return {
    basis: o.basis,
    targetAvailabilityPercent: o.target,
    baselineIndex: o.baselineIndex,
    smallestMeetingTargetIndex: smallestMeeting,
    bestValueIndex: bestValue,
    diminishingReturnsIndex: diminishing,
  };
}
