import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dishTradeoff, geoLookAngles, rainAttenuation, rainExceedance, type TradeoffScenario } from '@/server/engine';

// The laws of server/engine/README.md §5, as fast-check properties over wide input ranges (no source needed:
// they follow from the methods). Runs are seeded so a failure reproduces.
const RUNS = { numRuns: 300, seed: 20240611 };

const pathArb = fc.record({
  latDeg: fc.double({ min: -70, max: 70, noNaN: true }),
  stationHeightKm: fc.double({ min: 0, max: 2, noNaN: true }),
  frequencyGHz: fc.double({ min: 1, max: 55, noNaN: true }),
  elevationDeg: fc.double({ min: 1, max: 90, noNaN: true }),
  tiltDeg: fc.constantFrom(0, 45, 90, 23),
  r001MmH: fc.double({ min: 0.5, max: 200, noNaN: true }),
  rainHeightKm: fc.double({ min: 2.2, max: 5.4, noNaN: true }),
});
const pArb = fc.double({ min: Math.log(0.001), max: Math.log(5), noNaN: true }).map(Math.exp);

describe('laws of the rain model (ITU-R P.618-14 §2.2.1.1)', () => {
  it('exceedance(rainAttenuation(p)) is the largest p with that attenuation: ≥ p, same A to 1e-9, = p where step 10 is monotone', () => {
    fc.assert(
      fc.property(pathArb, pArb, (path, p) => {
        const pp = Math.min(5, Math.max(0.001, p));
        const a = rainAttenuation({ ...path, pPercent: pp });
        const ex = rainExceedance({ ...path, attenuationDb: a });
        expect(ex.bound).toBe('none');
        expect(ex.pPercent).toBeGreaterThanOrEqual(pp * (1 - 1e-9));
        expect(Math.abs(rainAttenuation({ ...path, pPercent: ex.pPercent }) / a - 1)).toBeLessThan(1e-9);
        // β = 0 at |φ| ≥ 36° and for p ≥ 1 %: step 10 is then monotone and the inverse is exact.
        if (Math.abs(path.latDeg) >= 36) expect(Math.abs(ex.pPercent / pp - 1)).toBeLessThan(1e-9);
      }),
      RUNS,
    );
  });

  it('a higher rain rate never gives less attenuation', () => {
    fc.assert(
      fc.property(pathArb, pArb, fc.double({ min: 1, max: 3, noNaN: true }), (path, p, factor) => {
        const pp = Math.min(5, Math.max(0.001, p));
        const a1 = rainAttenuation({ ...path, pPercent: pp });
        const a2 = rainAttenuation({ ...path, r001MmH: Math.min(300, path.r001MmH * factor), pPercent: pp });
        expect(a2).toBeGreaterThanOrEqual(a1 * (1 - 1e-12));
      }),
      RUNS,
    );
  });

  it('A_p falls as p grows where β = 0 (|φ| ≥ 36°); at low latitudes step 10 may rise just above 0.001 %', () => {
    fc.assert(
      fc.property(pathArb.filter((x) => Math.abs(x.latDeg) >= 36), pArb, pArb, (path, p1, p2) => {
        const [lo, hi] = [Math.min(p1, p2), Math.max(p1, p2)].map((p) => Math.min(5, Math.max(0.001, p)));
        expect(rainAttenuation({ ...path, pPercent: hi })).toBeLessThanOrEqual(rainAttenuation({ ...path, pPercent: lo }) * (1 + 1e-12));
      }),
      RUNS,
    );
  });
});

const scenarioArb = fc
  .record({
    latDeg: fc.double({ min: -65, max: 65, noNaN: true }),
    lonDeg: fc.double({ min: -180, max: 180, noNaN: true }),
    altitudeKm: fc.double({ min: 0, max: 2, noNaN: true }),
    satOffsetDeg: fc.double({ min: -50, max: 50, noNaN: true }),
    frequencyGHz: fc.double({ min: 3.4, max: 40, noNaN: true }),
    tiltDeg: fc.constantFrom(0, 45, 90),
    eirpDbw: fc.double({ min: 35, max: 62, noNaN: true }),
    symbolRateMsps: fc.double({ min: 0.5, max: 60, noNaN: true }),
    requiredEsN0Db: fc.double({ min: -2.35, max: 16, noNaN: true }),
    lnbNoiseTempK: fc.double({ min: 20, max: 300, noNaN: true }),
    antennaNoiseTempK: fc.double({ min: 10, max: 150, noNaN: true }),
    r001MmH: fc.double({ min: 0, max: 150, noNaN: true }),
    rainHeightKm: fc.double({ min: 2, max: 5.4, noNaN: true }),
    efficiency: fc.double({ min: 0.4, max: 0.8, noNaN: true }),
    diameters: fc.uniqueArray(fc.double({ min: 0.3, max: 4, noNaN: true }), { minLength: 2, maxLength: 8 }),
  })
  .map((x): TradeoffScenario => ({
    site: { latDeg: x.latDeg, lonDeg: x.lonDeg, altitudeKm: x.altitudeKm },
    satellite: { longitudeDeg: x.lonDeg + x.satOffsetDeg },
    downlink: { frequencyGHz: x.frequencyGHz, tiltDeg: x.tiltDeg, eirpDbw: x.eirpDbw, symbolRateMsps: x.symbolRateMsps, requiredEsN0Db: x.requiredEsN0Db, implementationMarginDb: 0.5 },
    receiver: { lnbNoiseTempK: x.lnbNoiseTempK, antennaNoiseTempK: x.antennaNoiseTempK },
    rain: { r001MmH: x.r001MmH, rainHeightKm: x.rainHeightKm },
    dishes: x.diameters.map((d) => ({ diameterM: d, efficiency: x.efficiency, priceUsd: (100 + d * 250).toFixed(2) })),
    targetAvailabilityPercent: 99.7,
  }))
  .filter((s) => geoLookAngles({ latDeg: s.site.latDeg, lonDeg: s.site.lonDeg, altitudeKm: s.site.altitudeKm, satelliteLongitudeDeg: s.satellite.longitudeDeg }).elevationDeg > 0.5);

describe('laws of the trade-off (server/engine/README.md §5)', () => {
  it('a larger dish never has more outage (no pointing error, same efficiency)', () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        const r = dishTradeoff(s);
        const bySize = [...r.options].sort((a, b) => a.diameterM - b.diameterM);
        for (let i = 1; i < bySize.length; i++) {
          expect(bySize[i].outagePercent).toBeLessThanOrEqual(bySize[i - 1].outagePercent + 1e-12);
          expect(bySize[i].outageMinutesPerYear).toBeLessThanOrEqual(bySize[i - 1].outageMinutesPerYear + 1e-9);
          expect(bySize[i].worstMonthOutageMinutes).toBeLessThanOrEqual(bySize[i - 1].worstMonthOutageMinutes + 1e-9);
        }
      }),
      { ...RUNS, numRuns: 200 },
    );
  });

  it('a higher rain rate never gives less outage', () => {
    fc.assert(
      fc.property(scenarioArb, fc.double({ min: 1, max: 2, noNaN: true }), (s, factor) => {
        const rain = s.rain as { r001MmH: number; rainHeightKm: number };
        const wetter = dishTradeoff({ ...s, rain: { ...rain, r001MmH: Math.min(1000, rain.r001MmH * factor) } });
        const r = dishTradeoff(s);
        r.options.forEach((o, i) => expect(wetter.options[i].outagePercent).toBeGreaterThanOrEqual(o.outagePercent - 1e-12));
      }),
      { ...RUNS, numRuns: 150 },
    );
  });

  it('every number in the result is finite (never NaN), and the recommendation points at real options', () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        const r = dishTradeoff(s);
        for (const o of r.options) {
          for (const [k, v] of Object.entries(o)) {
            if (typeof v === 'number') expect(Number.isFinite(v), k).toBe(true);
          }
          expect(o.closes).toBe(o.fadeThresholdDb !== null);
          if (!o.closes) expect(o.outagePercent).toBe(100);
          if (o.closes) expect(o.fadeThresholdDb!).toBeGreaterThan(0);
          expect(o.availabilityPercent).toBeGreaterThanOrEqual(0);
          expect(o.availabilityPercent).toBeLessThanOrEqual(100);
        }
        const rec = r.recommendation;
        for (const idx of [rec.baselineIndex, rec.diminishingReturnsIndex, rec.bestValueIndex, rec.smallestMeetingTargetIndex]) {
          if (idx !== null) expect(r.options[idx]).toBeDefined();
        }
        if (rec.smallestMeetingTargetIndex !== null) expect(r.options[rec.smallestMeetingTargetIndex].meetsTarget).toBe(true);
      }),
      { ...RUNS, numRuns: 200 },
    );
  });
});

describe('edge cases', () => {
  it('property generators reach the awkward corners: non-closing dishes, bounds at both ends', () => {
    const seen = new Set<string>();
    fc.assert(
      fc.property(scenarioArb, (s) => {
        for (const o of dishTradeoff(s).options) seen.add(o.closes ? o.outageBound : 'does-not-close');
      }),
      { ...RUNS, numRuns: 300 },
    );
    expect([...seen].sort()).toEqual(['above-model-range', 'below-model-range', 'does-not-close', 'none']);
  });
});
