import type { TradeoffScenario } from '@/server/engine';

/**
 * Test scenario: a Ku-band DTH-like carrier and eight dish sizes with invented prices. The site
 * sits at the coordinates of validation point V7 of ../shared/reference (a neutral label; only the
 * coordinates matter) and the satellite slot is a round number chosen for a mid elevation. Link
 * figures are plausible, not from any product.
 */
export function demoScenario(patch: Partial<TradeoffScenario> = {}): TradeoffScenario {
  return {
    site: { latDeg: 41.9, lonDeg: 12.49, altitudeKm: 0.05 },
    satellite: { longitudeDeg: 13 },
    downlink: { frequencyGHz: 11.7, tiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
    receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 35 },
    rain: { r001MmH: 33.9, rainHeightKm: 3.05 },
    dishes: [0.45, 0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8].map((d, i) => ({
      diameterM: d,
      efficiency: 0.65,
      priceUsd: (79.9 + 60 * i).toFixed(2),
      labourUsd: '120.00',
    })),
    targetAvailabilityPercent: 99.9,
    ...patch,
  };
}
