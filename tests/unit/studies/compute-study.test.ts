import { describe, expect, it } from 'vitest';
import { computeStudy } from '@/server/studies/compute-study';
import { downlinkTiltDeg, rainInputOf } from '@/server/studies/build-scenario';
import { ENGINE_VERSION, rainAttenuation } from '@/server/engine';
import { MAP_DATA_VERSION, siteClimate } from '@/server/climate-maps';
import { isEngineInputError } from '@/server/engine/errors';
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

  it('reads the maps as monthly normals of origin itu-r-maps, and a profile without h0 takes the fallback isotherm', () => {
    const maps = { ...climate, kind: 'itu-r-maps' as const, data: { monthlyRainfallMm: [1, 2], monthlyTemperatureC: [3, 4] }, zeroIsothermKm: 2.4 };
    expect(rainInputOf(maps as unknown as ClimateSnapshot)).toEqual({ monthlyRainfallMm: [1, 2], monthlyTemperatureC: [3, 4], origin: 'itu-r-maps', zeroIsothermHeightKm: 2.4 });
    expect(rainInputOf({ ...climate, zeroIsothermKm: null }, 2.38)).toEqual({ r001MmH: 35, zeroIsothermHeightKm: 2.38 });
    // The profile's own h0 wins over the map's.
    expect(rainInputOf(climate, 2.38)).toEqual({ r001MmH: 35, zeroIsothermHeightKm: 2.8 });
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

  it('a larger dish never has more outage (server/engine/README.md §5)', () => {
    const minutes = result.tradeoff.options.map((o) => o.outageMinutesPerYear);
    expect(minutes[1]).toBeLessThan(minutes[0]);
    expect(minutes[2]).toBeLessThan(minutes[1]);
  });

  it('stores a total exceedance curve over 0.001–5 % whose rain part agrees with rainAttenuation and which falls with p', () => {
    const c = result.exceedanceCurve;
    expect(result.tradeoff.attenuationModel).toBe('total');
    expect(c[0].pPercent).toBe(0.001);
    expect(c[c.length - 1].pPercent).toBe(5);
    for (let i = 1; i < c.length; i++) expect(c[i].attenuationDb).toBeLessThan(c[i - 1].attenuationDb);
    const mid = c[20];
    const again = rainAttenuation({
      latDeg: site.latDeg, stationHeightKm: 0.18, frequencyGHz: 11.8, elevationDeg: result.tradeoff.elevationDeg, tiltDeg: inputs.downlinkTiltDeg,
      r001MmH: 35, rainHeightKm: result.tradeoff.rainHeightKm, pPercent: mid.pPercent,
    });
    expect(mid.rainDb).toBe(again);
    // The total (P.618-14 §2.5) is more than the rain alone, and every part is there.
    for (const p of c) {
      expect(p.attenuationDb).toBeGreaterThan(p.rainDb!);
      expect([p.gasDb, p.cloudDb, p.scintillationDb].every((v) => typeof v === 'number' && v > 0)).toBe(true);
    }
    // h_R = h0 + 0.36 km (ITU-R P.839-4): the profile's own h0.
    expect(result.tradeoff.rainHeightKm).toBeCloseTo(3.16, 12);
    expect(inputs.siteMaps?.isothermUsed).toBe(false);
  });

  it('draws the curve for the recommended dish: it meets that dish’s fade threshold at its outage', () => {
    const i = result.exceedanceCurveOptionIndex!;
    expect(i).toBe(result.tradeoff.recommendation.smallestMeetingTargetIndex ?? 0);
    const o = result.tradeoff.options[i];
    expect(o.outageBound).toBe('none');
    // Linear in ln p between the two stored points around the outage: close to A*, not exact (41 points).
    const c = result.exceedanceCurve;
    const k = c.findIndex((p) => p.pPercent > o.outagePercent);
    const w = Math.log(o.outagePercent / c[k - 1].pPercent) / Math.log(c[k].pPercent / c[k - 1].pPercent);
    const between = c[k - 1].attenuationDb + w * (c[k].attenuationDb - c[k - 1].attenuationDb);
    expect(Math.abs(between - o.fadeThresholdDb!) / o.fadeThresholdDb!).toBeLessThan(0.02);
    expect(o.attenuationAtOutage!.totalDb).toBeCloseTo(o.fadeThresholdDb!, 6);
  });

  it('is plain JSON (survives a round trip unchanged)', () => {
    expect(JSON.parse(JSON.stringify({ inputs, result }))).toEqual({ inputs, result });
  });

  // Edge case: a satellite below the horizon is refused by the engine with the field named.
  it('lets the engine refuse a satellite below the horizon', () => {
    expect(() => computeStudy({ site, service: { ...service, satelliteLongitudeDeg: 150 }, climate, dishes: [dish(60, '1')], targetAvailabilityPercent: 99.9 })).toThrow(/horizon/);
  });
});

describe('computeStudy from the site’s coordinates (ITU-R maps)', () => {
  const { inputs, result } = computeStudy({ site, service, climate: null, dishes: [dish(60, '89.00'), dish(90, '189.00')], targetAvailabilityPercent: 99.9 });
  const atSite = siteClimate({ latDeg: site.latDeg, lonDeg: site.lonDeg });

  it('takes the rain climate from the maps: R0.01 and P0 are the site’s, h0 is the P.839-4 map value', () => {
    expect(inputs.climate).toMatchObject({ id: null, kind: 'itu-r-maps', zeroIsothermKm: atSite.isothermHeightKm });
    expect(result.tradeoff.climateSource.kind).toBe('itu-r-maps');
    expect(result.tradeoff.climateSource.r001MmH).toBeCloseTo(atSite.r001MmH, 9);
    expect(result.tradeoff.climateSource.p0Percent).toBeCloseTo(atSite.p0Percent, 9);
    expect(result.tradeoff.rainHeightKm).toBeCloseTo(atSite.isothermHeightKm + 0.36, 12);
    expect(inputs.siteMaps).toMatchObject({ isothermUsed: true, mapDataVersion: MAP_DATA_VERSION, nWetMedian: atSite.nWetMedian });
    expect(inputs.siteMaps!.mapVersions).toEqual(expect.arrayContaining(['ITU-R P.836-6', 'ITU-R P.840-8', 'ITU-R P.1511-1', `maps:${MAP_DATA_VERSION}`]));
  });

  it('computes every outage on the P.618-14 §2.5 total, with the four causes at each dish’s outage', () => {
    expect(result.tradeoff.attenuationModel).toBe('total');
    expect(result.tradeoff.atmosphere!.nWetMedian).toBeCloseTo(atSite.nWetMedian, 9);
    for (const o of result.tradeoff.options) {
      const a = o.attenuationAtOutage!;
      expect(a.totalDb).toBeCloseTo(o.fadeThresholdDb!, 6);
      expect(a.rainDb).toBeLessThan(a.totalDb);
      expect(a.gasDb).toBeGreaterThan(0);
    }
  });

  it('an override without its own h0 takes the P.839-4 map value at the site, never the latitude approximation', () => {
    const noH0 = computeStudy({ site, service, climate: { ...climate, zeroIsothermKm: null }, dishes: [dish(60, '1')], targetAvailabilityPercent: 99.9 });
    expect(noH0.result.tradeoff.rainHeightSource).toBe('zero-isotherm');
    expect(noH0.result.tradeoff.rainHeightKm).toBeCloseTo(atSite.isothermHeightKm + 0.36, 12);
    expect(noH0.inputs.siteMaps!.isothermUsed).toBe(true);
    // Only the rain climate is overridden: R0.01 is the profile's, gases and clouds still the maps'.
    expect(noH0.result.tradeoff.climateSource.r001MmH).toBe(35);
    expect(noH0.result.tradeoff.attenuationModel).toBe('total');
  });

  // Edge case: a site where the maps are blank is refused on the latitude, before any figure exists.
  it('refuses a site with no map data (88.9° N) with EngineInputError on site.latDeg', () => {
    let error: unknown;
    try {
      computeStudy({ site: { ...site, latDeg: 88.9, lonDeg: 45 }, service, climate: null, dishes: [dish(60, '1')], targetAvailabilityPercent: 99.9 });
    } catch (e) {
      error = e;
    }
    expect(isEngineInputError(error) && error.field).toBe('site.latDeg');
  });
});
