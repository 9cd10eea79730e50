import Decimal from 'decimal.js';

/** Economics of each option against the baseline (smallest) dish. */
export interface TradeoffEconomics {
  priceUsd: (string | null)[];
  minutesSavedPerYear: number[];
  costPerMinuteSavedUsd: (string | null)[];
  /** Same as costPerMinuteSavedUsd, unrounded, for ranking. */
  costPerMinuteSaved: (Decimal | null)[];
}

/**
 * Minutes saved per year and cost per minute saved against the smallest dish (server/engine/README.md §5):
 * saved_i = minutes_baseline − minutes_i; cost_i = (price_i − price_baseline)/saved_i in USD per
 * (minute per year), computed in decimal.js. Convention: the cost is null for the baseline, when
 * either price is missing, or when the dish saves nothing (saved ≤ 0). A cost can be negative
 * when a bigger dish is also cheaper.
 *
 * Bad input: callers pass validated prices (see parseMoneyUsd) and engine-made minutes.
 *
 * @example
 * tradeoffEconomics({ prices: [new Decimal(300), new Decimal(420)], outageMinutesPerYear: [300, 60], baselineIndex: 0 })
 * // => { priceUsd: ['300.00', '420.00'], minutesSavedPerYear: [0, 240], costPerMinuteSavedUsd: [null, '0.5000'], … }
 */
export function tradeoffEconomics(o: {
  prices: readonly (Decimal | null)[];
  outageMinutesPerYear: readonly number[];
  baselineIndex: number;
}): TradeoffEconomics {
  const base = o.outageMinutesPerYear[o.baselineIndex];
  const basePrice = o.prices[o.baselineIndex];
  const priceUsd: (string | null)[] = [];
  const minutesSavedPerYear: number[] = [];
  const costPerMinuteSavedUsd: (string | null)[] = [];
  const costPerMinuteSaved: (Decimal | null)[] = [];
  for (let i = 0; i < o.prices.length; i++) {
    const price = o.prices[i];
    const saved = base - o.outageMinutesPerYear[i];
    priceUsd.push(price ? price.toFixed(2) : null);
    minutesSavedPerYear.push(saved);
    let cost: Decimal | null = null;
    if (i !== o.baselineIndex && price && basePrice && saved > 0) {
      cost = price.minus(basePrice).dividedBy(new Decimal(saved));
    }
    costPerMinuteSaved.push(cost);
    costPerMinuteSavedUsd.push(cost ? cost.toFixed(4) : null);
  }
  return { priceUsd, minutesSavedPerYear, costPerMinuteSavedUsd, costPerMinuteSaved };
}
