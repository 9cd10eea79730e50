import { describe, expect, it } from 'vitest';
import { computeStudy } from '@/server/studies/compute-study';
import { downlinkTiltDeg, rainInputOf } from '@/server/studies/build-scenario';
import { ENGINE_VERSION, rainAttenuation } from '@/server/engine';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot, SiteSnapshot } from '@/server/studies/snapshot';

// Invented site, satellite and prices (demo data).
const site: SiteSnapshot = { id: 1, name: 'Hillfold barn', customerId: 1, customerName: 'Marrow & Finch', latDeg: 47.25, lonDeg: 2.5, altitudeM: 180 };
const service: ServiceSnapshot = {
  id: 1, name: 'Corvid TV', satelliteName: 'Corvid-2', satelliteLongitudeDeg: -19.5, downlinkFrequencyGHz: 11.8, polarization: 'linear-vertical',
  polarizationTiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, modcod: '8PSK 3/4', requiredEsN0Db: 7.91, implementationMarginDb: 1, otherLossesDb: 0.3,
  lnbNoiseTempK: 60, antennaNoiseTempK: 40, uplink: null, acmModcods: null,
};
const climate: ClimateSnapshot = { id: 1, name: 'Known', kind: 'known-r001', data: { r001MmH: 35 }, zeroIsothermKm: 2.8, sourceNote: 'invented' };
const dish = (cm: number, price: string): DishSnapshot => ({ dishId: cm, name: `D${cm}`, diameterM: cm / 100, efficiency: 0.65, hardwarePrice: price, labourPrice: '90.00', mountNotes: null });

describe('downlinkTiltDeg (ITU-R P.838-3 τ from the skew)', () => {
  it('is 45° for circular, the skew for H, 90° minus the skew for V, folded into 0–90°', () => {
    expect(downlinkTiltDeg('circular', 10, 33)).toBe(45);
    expect(downlinkTiltDeg('linear-horizontal', 0, 12)).toBe(12);
    expect(downlinkTiltDeg('linear-horizontal', 0, -12)).toBe(12);
    expect(downlinkTiltDeg('linear-vertical', 0, 12)).toBe(78);
    expect(downlinkTiltDeg('linear-vertical', 0, -12)).toBe(78);
    expect(downlinkTiltDeg('linear-horizontal', 5, 0)).toBe(5);
  });
});

describe('rainInputOf', () => {
  it('maps each climate kind to its engine source and carries h0', () => {
    expect(rainInputOf(climate)).toEqual({ r001MmH: 35, zeroIsothermHeightKm: 2.8 });
    expect(rainInputOf({ ...climate, kind: 'climate-zone', data: { zone: 'K' }, zeroIsothermKm: null })).toEqual({ climateZone: 'K' });
    expect(rainInputOf({ ...climate, kind: 'measured-curve', data: { points: [{ pPercent: 1, rainRateMmH: 2 }] } })).toEqual({ measuredCurve: [{ pPercent: 1, rainRateMmH: 2 }], zeroIsothermHeightKm: 2.8 });
  });
});

describe('computeStudy', () => {
  const { inputs, result } = computeStudy({ site, service, climate, dishes: [dish(90, '189.00'), dish(60, '89.00'), dish(120, '329.00')], targetAvailabilityPercent: 99.95 });

  it('orders dishes small to large, copies them into the snapshot and stamps the engine version', () => {
    expect(inputs.dishes.map((d) => d.diameterM)).toEqual([0.6, 0.9, 1.2]);
    expect(inputs.scenario.dishes.map((d) => [d.diameterM, d.priceUsd, d.labourUsd])).toEqual([
      [0.6, '89.00', '90.00'],
      [0.9, '189.00', '90.00'],
      [1.2, '329.00', '90.00'],
    ]);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    expect(result.tradeoff.options.map((o) => o.priceUsd)).toEqual(['179.00', '279.00', '419.00']);
  });

  it('a larger dish never has more outage (engine.md §5)', () => {
    const minutes = result.tradeoff.options.map((o) => o.outageMinutesPerYear);
    expect(minutes[1]).toBeLessThan(minutes[0]);
    expect(minutes[2]).toBeLessThan(minutes[1]);
  });

  it('stores an exceedance curve over 0.001–5 % that agrees with rainAttenuation at each point and falls with p', () => {
    const c = result.exceedanceCurve;
    expect(c[0].pPercent).toBe(0.001);
    expect(c[c.length - 1].pPercent).toBe(5);
    for (let i = 1; i < c.length; i++) expect(c[i].attenuationDb).toBeLessThan(c[i - 1].attenuationDb);
    const mid = c[20];
    const again = rainAttenuation({
      latDeg: site.latDeg, stationHeightKm: 0.18, frequencyGHz: 11.8, elevationDeg: result.tradeoff.elevationDeg, tiltDeg: inputs.downlinkTiltDeg,
      r001MmH: 35, rainHeightKm: result.tradeoff.rainHeightKm, pPercent: mid.pPercent,
    });
    expect(mid.attenuationDb).toBe(again);
    // h_R = h0 + 0.36 km (ITU-R P.839-4).
    expect(result.tradeoff.rainHeightKm).toBeCloseTo(3.16, 12);
  });

  it('is plain JSON (survives a round trip unchanged)', () => {
    expect(JSON.parse(JSON.stringify({ inputs, result }))).toEqual({ inputs, result });
  });

  // Edge case: a satellite below the horizon is refused by the engine with the field named.
  it('lets the engine refuse a satellite below the horizon', () => {
    expect(() => computeStudy({ site, service: { ...service, satelliteLongitudeDeg: 150 }, climate, dishes: [dish(60, '1')], targetAvailabilityPercent: 99.9 })).toThrow(/horizon/);
  });
});
