import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siteAtmosphere, siteClimate } from '@/server/climate-maps';
import { dishTradeoff, type TradeoffScenario } from '@/server/engine';
import { demoScenario } from '../engine/tradeoff-fixture';

// The trade-off judged on the ITU-R P.618-14 §2.5 total (server/engine/README.md §7). No outside figure is
// needed here: the component figures themselves are checked against the SG 3 validation rows in
// total-attenuation.test.ts; these tests check how the trade-off uses them.

/** The demo carrier at a site whose climate and atmosphere come from the maps (as a study builds it). */
function mapsScenario(latDeg: number, lonDeg: number, patch: Partial<TradeoffScenario> = {}): TradeoffScenario {
  const c = siteClimate({ latDeg, lonDeg });
  const h = Math.max(0, c.topographicHeightKm);
  return demoScenario({
    site: { latDeg, lonDeg, altitudeKm: h },
    satellite: { longitudeDeg: lonDeg + 3 },
    rain: { monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC, origin: 'itu-r-maps', zeroIsothermHeightKm: c.isothermHeightKm },
    atmosphere: siteAtmosphere({ latDeg, lonDeg, stationHeightKm: h }),
    ...patch,
  });
}
const ka = (s: TradeoffScenario): TradeoffScenario => ({ ...s, downlink: { ...s.downlink, frequencyGHz: 19.7, eirpDbw: 56 } });

describe('dishTradeoff with the site atmosphere: outages on the P.618-14 §2.5 total', () => {
  const withTotal = dishTradeoff(ka(mapsScenario(51.5, -0.14)));
  const { atmosphere: _a, ...rainOnlyScenario } = ka(mapsScenario(51.5, -0.14));
  const rainOnly = dishTradeoff(rainOnlyScenario);

  it('says which model it used and the climate source', () => {
    expect(withTotal.attenuationModel).toBe('total');
    expect(rainOnly.attenuationModel).toBe('rain');
    expect(withTotal.climateSource.kind).toBe('itu-r-maps');
    expect(withTotal.climateSource.r001MmH).toBeCloseTo(siteClimate({ latDeg: 51.5, lonDeg: -0.14 }).r001MmH, 9);
    expect(withTotal.atmosphere?.gas1PctDb).toBeGreaterThan(0);
    expect(withTotal.atmosphere?.cloud1PctDb).toBeGreaterThan(0);
  });

  it('gases, clouds and scintillation only add outage: every dish is out at least as long as with rain alone', () => {
    withTotal.options.forEach((o, i) => {
      expect(o.outagePercent).toBeGreaterThanOrEqual(rainOnly.options[i].outagePercent * (1 - 1e-12));
    });
    // and at Ka band they matter: the smallest dish loses visibly more
    expect(withTotal.options[0].outageMinutesPerYear).toBeGreaterThan(rainOnly.options[0].outageMinutesPerYear * 1.05);
  });

  it('each dish reports its components at the outage, and they combine to its fade threshold', () => {
    for (const o of withTotal.options) {
      if (!o.closes) continue;
      const c = o.attenuationAtOutage!;
      expect(c).not.toBeNull();
      if (o.outageBound === 'none') expect(c.totalDb).toBeCloseTo(o.fadeThresholdDb!, 8);
      // §2.5 with gases and clouds held at 1 % below 1 %
      if (o.outagePercent < 1) {
        const g1 = withTotal.atmosphere!.gas1PctDb;
        const c1 = withTotal.atmosphere!.cloud1PctDb;
        expect(c.totalDb).toBeCloseTo(g1 + Math.hypot(c.rainDb + c1, c.scintillationDb), 9);
      }
    }
    expect(rainOnly.options[0].attenuationAtOutage).toBeNull();
  });

  it('a bigger dish never has more outage on the total (property over sites from the maps)', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 58, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }), fc.boolean(), (lat, lon, isKa) => {
        const s = mapsScenario(lat, lon);
        const r = dishTradeoff(isKa ? ka(s) : s);
        for (let i = 1; i < r.options.length; i++) {
          expect(r.options[i].outagePercent).toBeLessThanOrEqual(r.options[i - 1].outagePercent * (1 + 1e-9));
        }
      }),
      { numRuns: 40, seed: 20261204 },
    );
  });
});

describe('edge cases', () => {
  it('below 5° elevation the atmosphere is left out with a warning, never a number from outside its range', () => {
    // A slot 78° away in longitude from a mid-latitude site: a few degrees above the horizon.
    const s = mapsScenario(40, 10, { satellite: { longitudeDeg: 10 + 76 } });
    const r = dishTradeoff(s);
    expect(r.elevationDeg).toBeLessThan(5);
    expect(r.elevationDeg).toBeGreaterThan(0);
    expect(r.attenuationModel).toBe('rain');
    expect(r.warnings.map((w) => w.code)).toContain('atmosphere-skipped');
  });
  it('a malformed atmosphere is refused naming the field', () => {
    const s = mapsScenario(51.5, -0.14);
    const bad = { ...s, atmosphere: { ...s.atmosphere!, levels: s.atmosphere!.levels.map((l, i) => (i === 2 ? { ...l, waterVapourContentKgM2: 1e9 } : l)) } };
    expect(() => dishTradeoff(bad)).toThrow(/atmosphere\.levels\[2\]\.waterVapourContentKgM2/);
  });
  it('the uplink of a two-way terminal also reports its components', () => {
    const s = ka(mapsScenario(51.5, -0.14));
    const r = dishTradeoff({ ...s, uplink: { frequencyGHz: 29.5, tiltDeg: 90, terminalEirpDbw: 48, satelliteGOverTDbK: 12, symbolRateMsps: 5, requiredEsN0Db: 2 } });
    const up = r.options.find((o) => o.uplink?.closes)?.uplink;
    expect(up?.attenuationAtOutage?.totalDb).toBeGreaterThan(0);
  });
});
