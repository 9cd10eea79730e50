import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import {
  ENGINE_VERSION,
  EngineInputError,
  MINUTES_PER_MONTH,
  MINUTES_PER_YEAR,
  dishGain,
  dishTradeoff,
  downlinkDegradation,
  geoLookAngles,
  latitudeIsothermHeight,
  monthlyRainClimate,
  rainAttenuation,
  rainExceedance,
  worstMonthPercent,
  type TradeoffScenario,
} from '@/server/engine';
import { demoScenario } from './tradeoff-fixture';

// The trade-off chains published methods (each checked against its reference file elsewhere);
// here every number of the result is re-derived from the public functions, so a wrong link in
// the chain fails. Scenario data are invented (tradeoff-fixture.ts).

function expectEngineError(call: () => unknown, field: string, message?: RegExp): void {
  try {
    call();
    expect.unreachable(`expected an EngineInputError for ${field}`);
  } catch (e) {
    expect(e).toBeInstanceOf(EngineInputError);
    expect((e as EngineInputError).field).toBe(field);
    if (message) expect((e as Error).message).toMatch(message);
  }
}

describe('dishTradeoff: the chain of server/engine/README.md §4 for every dish', () => {
  const s = demoScenario();
  const r = dishTradeoff(s);
  const look = geoLookAngles({ latDeg: s.site.latDeg, lonDeg: s.site.lonDeg, altitudeKm: s.site.altitudeKm, satelliteLongitudeDeg: s.satellite.longitudeDeg });
  const path = { latDeg: 41.9, stationHeightKm: 0.05, frequencyGHz: 11.7, elevationDeg: look.elevationDeg, tiltDeg: 0, r001MmH: 33.9, rainHeightKm: 3.05 };

  it('reports geometry, rain height, climate source and engine version', () => {
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(r.elevationDeg).toBe(look.elevationDeg);
    expect(r.azimuthDeg).toBe(look.azimuthDeg);
    expect(r.rangeKm).toBe(look.rangeKm);
    expect(r.rainHeightKm).toBe(3.05);
    expect(r.rainHeightSource).toBe('given');
    expect(r.climateSource).toMatchObject({ kind: 'r001', r001MmH: 33.9 });
    expect(r.rainAttenuation001Db).toBeCloseTo(rainAttenuation({ ...path, pPercent: 0.01 }), 12);
    expect(r.options).toHaveLength(8);
  });

  it.each([0, 1, 2, 3, 4, 5, 6, 7])('option %i: gain, G/T, Es/N0, margin, A*, outage, minutes, worst month re-derive', (i) => {
    const o = r.options[i];
    const d = s.dishes[i];
    expect(o.index).toBe(i);
    expect(o.diameterM).toBe(d.diameterM);
    expect(o.gainDbi).toBeCloseTo(dishGain({ diameterM: d.diameterM, efficiency: d.efficiency, frequencyGHz: 11.7 }), 12);
    expect(o.gOverTDbK).toBeCloseTo(o.gainDbi - 10 * Math.log10(95), 12);
    const fsl = 20 * Math.log10((4 * Math.PI * look.rangeKm * 1e3 * 11.7e9) / 299_792_458);
    expect(o.cOverN0DbHz).toBeCloseTo(50 - fsl + o.gOverTDbK + 228.6, 10);
    expect(o.clearSkyEsN0Db).toBeCloseTo(o.cOverN0DbHz - 10 * Math.log10(27.5e6), 10);
    expect(o.marginDb).toBeCloseTo(o.clearSkyEsN0Db - 8.91, 10);
    expect(o.closes).toBe(true);
    expect(downlinkDegradation({ lnbNoiseTempK: 60, antennaNoiseTempK: 35, attenuationDb: o.fadeThresholdDb! })).toBeCloseTo(o.marginDb, 9);
    const ex = rainExceedance({ ...path, attenuationDb: o.fadeThresholdDb! });
    expect(o.outagePercent).toBeCloseTo(ex.pPercent, 12);
    expect(o.outageBound).toBe(ex.bound);
    expect(o.availabilityPercent).toBeCloseTo(100 - o.outagePercent, 12);
    expect(o.outageMinutesPerYear).toBeCloseTo((o.outagePercent / 100) * MINUTES_PER_YEAR, 9);
    expect(o.worstMonthOutagePercent).toBeCloseTo(worstMonthPercent({ pPercent: o.outagePercent }), 12);
    expect(o.worstMonthOutageMinutes).toBeCloseTo((o.worstMonthOutagePercent / 100) * MINUTES_PER_MONTH, 9);
  });

  it('bigger dishes lose fewer minutes, and the 1.2 m is the smallest meeting 99.9 %', () => {
    for (let i = 1; i < 8; i++) expect(r.options[i].outageMinutesPerYear).toBeLessThan(r.options[i - 1].outageMinutesPerYear);
    const meeting = r.options.filter((o) => o.availabilityPercent >= 99.9).map((o) => o.index);
    expect(r.recommendation.smallestMeetingTargetIndex).toBe(meeting[0]);
    expect(r.options.map((o) => o.meetsTarget)).toEqual(r.options.map((o) => o.availabilityPercent >= 99.9));
  });
});

describe('economics in decimal.js against the smallest dish (server/engine/README.md §5)', () => {
  const s = demoScenario();
  const r = dishTradeoff(s);
  it('price = hardware + labour, exact to the cent', () => {
    r.options.forEach((o, i) => {
      expect(o.priceUsd).toBe(new Decimal(s.dishes[i].priceUsd as string).plus('120.00').toFixed(2));
    });
    const cents = dishTradeoff(demoScenario({ dishes: [{ diameterM: 0.6, efficiency: 0.6, priceUsd: '0.10', labourUsd: '0.20' }] }));
    expect(cents.options[0].priceUsd).toBe('0.30');
  });
  it('minutes saved and cost per minute saved count against the smallest dish', () => {
    const base = r.options[0];
    expect(r.recommendation.baselineIndex).toBe(0);
    expect(base.minutesSavedPerYear).toBe(0);
    expect(base.costPerMinuteSavedUsd).toBeNull();
    for (const o of r.options.slice(1)) {
      expect(o.minutesSavedPerYear).toBeCloseTo(base.outageMinutesPerYear - o.outageMinutesPerYear, 9);
      const expected = new Decimal(o.priceUsd!).minus(base.priceUsd!).dividedBy(o.minutesSavedPerYear).toFixed(4);
      expect(o.costPerMinuteSavedUsd).toBe(expected);
    }
  });
  it('the baseline is the smallest diameter even when dishes come in another order', () => {
    const shuffled = demoScenario({ dishes: [...demoScenario().dishes].reverse() });
    const rr = dishTradeoff(shuffled);
    expect(rr.recommendation.baselineIndex).toBe(7);
    expect(rr.options[7].diameterM).toBe(0.45);
    expect(rr.options[0].minutesSavedPerYear).toBeCloseTo(r.options[7].minutesSavedPerYear, 9);
    expect(rr.options[rr.recommendation.smallestMeetingTargetIndex!].diameterM).toBe(r.options[r.recommendation.smallestMeetingTargetIndex!].diameterM);
  });
  it('best value is the lowest cost per minute saved; diminishing returns is the smallest dish with ≥ 90 % of the largest saving', () => {
    const costs = r.options.map((o) => (o.costPerMinuteSavedUsd === null ? Infinity : Number(o.costPerMinuteSavedUsd)));
    expect(r.recommendation.bestValueIndex).toBe(costs.indexOf(Math.min(...costs)));
    const maxSaved = Math.max(...r.options.map((o) => o.minutesSavedPerYear));
    const knee = r.options.find((o) => o.minutesSavedPerYear >= 0.9 * maxSaved)!;
    expect(r.recommendation.diminishingReturnsIndex).toBe(knee.index);
    expect(knee.index).toBeGreaterThan(0);
    expect(knee.index).toBeLessThan(7);
  });
  it('without prices there is no cost per minute and no best value, but minutes saved remain', () => {
    const rr = dishTradeoff(demoScenario({ dishes: demoScenario().dishes.map((d) => ({ diameterM: d.diameterM, efficiency: d.efficiency })) }));
    expect(rr.options.every((o) => o.priceUsd === null && o.costPerMinuteSavedUsd === null)).toBe(true);
    expect(rr.recommendation.bestValueIndex).toBeNull();
    expect(rr.options[3].minutesSavedPerYear).toBeGreaterThan(0);
  });
});

describe('rain climate sources (server/engine/README.md §1) and rain height (ITU-R P.839-4)', () => {
  const months = {
    monthlyRainfallMm: [72.6, 69.5, 65.0, 68.0, 48.2, 33.4, 20.5, 34.4, 72.2, 98.5, 112.2, 94.1],
    monthlyTemperatureC: [6.9, 7.3, 9.8, 12.6, 17.1, 21.1, 24.0, 24.1, 20.2, 16.3, 11.5, 8.0],
  };
  it('monthly normals: R0.01 from ITU-R P.837-7 Annex 1, with P0, labelled', () => {
    const r = dishTradeoff(demoScenario({ rain: { ...months, rainHeightKm: 3.05 } }));
    const climate = monthlyRainClimate(months);
    expect(r.climateSource.kind).toBe('monthly-normals');
    expect(r.climateSource.r001MmH).toBeCloseTo(climate.rainRateExceeded(0.01), 10);
    expect(r.climateSource.p0Percent).toBeCloseTo(climate.p0Percent, 12);
    expect(r.climateSource.label).toMatch(/P\.837-7 Annex 1/);
  });
  it('measured curve: R0.01 by log-log interpolation when 0.01 % is inside the measured range', () => {
    const curve = [{ pPercent: 0.1, rainRateMmH: 12 }, { pPercent: 0.001, rainRateMmH: 75 }];
    const r = dishTradeoff(demoScenario({ rain: { measuredCurve: curve, rainHeightKm: 3.05 } }));
    expect(r.climateSource.kind).toBe('measured-curve');
    expect(r.climateSource.r001MmH).toBeCloseTo(Math.sqrt(12 * 75), 10);
  });
  it('measured curve not reaching 0.01 %: typed error naming rain.measuredCurve, no extrapolation', () => {
    const curve = [{ pPercent: 1, rainRateMmH: 3 }, { pPercent: 0.03, rainRateMmH: 20 }];
    expectEngineError(() => dishTradeoff(demoScenario({ rain: { measuredCurve: curve } })), 'rain.measuredCurve', /not extrapolated/);
  });
  it('climate zone K: R0.01 = 42 mm/h from the ITU-R P.837-1 table (typed from memory)', () => {
    const r = dishTradeoff(demoScenario({ rain: { climateZone: 'K', rainHeightKm: 3.05 } }));
    expect(r.climateSource).toMatchObject({ kind: 'climate-zone', r001MmH: 42 });
  });
  it('no rain height: the latitude approximation of older P.839 editions, labelled and warned', () => {
    const r = dishTradeoff(demoScenario({ rain: { r001MmH: 33.9 } }));
    expect(r.rainHeightSource).toBe('latitude-approximation');
    expect(r.rainHeightKm).toBeCloseTo(latitudeIsothermHeight({ latDeg: 41.9 }) + 0.36, 12);
    expect(r.warnings.map((w) => w.code)).toContain('rain-height-approximation');
  });
  it('a 0 °C isotherm height gives h_R = h_0 + 0.36 km (ITU-R P.839-4 eq. 1)', () => {
    const r = dishTradeoff(demoScenario({ rain: { r001MmH: 33.9, zeroIsothermHeightKm: 2.69 } }));
    expect(r.rainHeightSource).toBe('zero-isotherm');
    expect(r.rainHeightKm).toBeCloseTo(3.05, 12);
  });
});

describe('optional layers: uplink, ACM, scintillation', () => {
  const uplink = { frequencyGHz: 14.25, tiltDeg: 90, terminalEirpDbw: 48, satelliteGOverTDbK: 3, symbolRateMsps: 2, requiredEsN0Db: 4.03, implementationMarginDb: 1 };

  it('uplink: A*_up = margin (no noise increase at the satellite); two-way = p_up + p_down, an upper bound, and the basis', () => {
    const r = dishTradeoff(demoScenario({ uplink }));
    expect(r.recommendation.basis).toBe('two-way');
    expect(r.warnings.map((w) => w.code)).toContain('two-way-upper-bound');
    for (const o of r.options) {
      const up = o.uplink!;
      expect(up.eirpDbw).toBe(48);
      if (up.closes) expect(up.fadeThresholdDb).toBe(up.marginDb);
      expect(o.twoWay!.isUpperBound).toBe(true);
      expect(o.twoWay!.outagePercent).toBeCloseTo(Math.min(100, up.outagePercent + o.outagePercent), 12);
      expect(o.meetsTarget).toBe(o.twoWay!.outageBound !== 'above-model-range' && o.twoWay!.availabilityPercent >= 99.9);
    }
    expect(r.options[3].minutesSavedPerYear).toBeCloseTo(r.options[0].twoWay!.outageMinutesPerYear - r.options[3].twoWay!.outageMinutesPerYear, 9);
  });

  it('uplink from HPA power: EIRP = 10 log10 P + gain at the uplink frequency − feed loss', () => {
    const { terminalEirpDbw: _drop, ...rest } = uplink;
    const r = dishTradeoff(demoScenario({ uplink: { ...rest, hpaPowerW: 2, feedLossDb: 0.5 } }));
    for (const o of r.options) {
      expect(o.uplink!.eirpDbw).toBeCloseTo(10 * Math.log10(2) + dishGain({ diameterM: o.diameterM, efficiency: 0.65, frequencyGHz: 14.25 }) - 0.5, 10);
    }
  });

  it('ACM with only the service MODCOD reproduces the fixed-carrier outage and throughput (1 − p) η R_s', () => {
    const r = dishTradeoff(demoScenario({ acm: { modcods: ['8PSK 3/4'] } }));
    for (const o of r.options) {
      expect(o.acm!.shares[0]).toEqual({ modcod: 'outage', sharePercent: o.outagePercent });
      expect(o.acm!.expectedThroughputMbps).toBeCloseTo((1 - o.outagePercent / 100) * 2.228124 * 27.5, 9);
    }
  });

  it('ACM over a MODCOD set: shares sum to 100 %, throughput ≤ clear-sky throughput and grows with dish size', () => {
    const r = dishTradeoff(demoScenario({ acm: { modcods: ['QPSK 1/2', 'QPSK 3/4', '8PSK 2/3', '8PSK 3/4', '16APSK 2/3', '16APSK 3/4', '32APSK 3/4'] } }));
    let last = 0;
    for (const o of r.options) {
      const a = o.acm!;
      expect(a.shares.reduce((t, x) => t + x.sharePercent, 0)).toBeCloseTo(100, 9);
      expect(a.expectedThroughputMbps).toBeLessThanOrEqual(a.clearSkyThroughputMbps + 1e-9);
      expect(a.expectedThroughputMbps).toBeGreaterThanOrEqual(last);
      last = a.expectedThroughputMbps;
    }
  });

  it('scintillation layer: √(A_R² + A_S²) can only add outage; shown separately', () => {
    const plain = dishTradeoff(demoScenario());
    const r = dishTradeoff(demoScenario({ scintillation: { nWet: 60 } }));
    r.options.forEach((o, i) => {
      expect(o.outagePercent).toBe(plain.options[i].outagePercent);
      expect(o.scintillation!.outagePercent).toBeGreaterThanOrEqual(o.outagePercent);
      expect(o.scintillation!.sigmaDb).toBeGreaterThan(0);
    });
  });
});

describe('edge cases', () => {
  it('a dish that does not close: closes false, no fade threshold, out 100 % of the year (it never works)', () => {
    const r = dishTradeoff(demoScenario({ dishes: [{ diameterM: 0.2, efficiency: 0.6, priceUsd: '50' }, { diameterM: 0.9, efficiency: 0.65, priceUsd: '200' }] }));
    const o = r.options[0];
    expect(o.marginDb).toBeLessThan(0);
    expect(o.closes).toBe(false);
    expect(o.fadeThresholdDb).toBeNull();
    expect(o).toMatchObject({ outagePercent: 100, outageBound: 'none', availabilityPercent: 0, outageMinutesPerYear: MINUTES_PER_YEAR, worstMonthOutageMinutes: MINUTES_PER_MONTH, meetsTarget: false });
    expect(r.warnings.find((w) => w.code === 'dish-does-not-close')?.optionIndex).toBe(0);
    expect(r.options[1].minutesSavedPerYear).toBeCloseTo(MINUTES_PER_YEAR - r.options[1].outageMinutesPerYear, 6);
  });

  it('an outage below 0.001 % is reported as that upper bound with its flag (availability "> 99.999")', () => {
    const r = dishTradeoff(demoScenario({ dishes: [{ diameterM: 4.5, efficiency: 0.7 }], targetAvailabilityPercent: 99.99 }));
    expect(r.options[0]).toMatchObject({ outagePercent: 0.001, outageBound: 'below-model-range', availabilityPercent: 99.999, meetsTarget: true });
    expect(r.warnings.map((w) => w.code)).toContain('outage-below-model-range');
  });

  it('an outage above 5 % is a lower bound and never meets a target', () => {
    const r = dishTradeoff(demoScenario({ downlink: { ...demoScenario().downlink, eirpDbw: 41 }, dishes: [{ diameterM: 0.9, efficiency: 0.65 }], targetAvailabilityPercent: 90 }));
    expect(r.options[0]).toMatchObject({ closes: true, outagePercent: 5, outageBound: 'above-model-range', meetsTarget: false });
    expect(r.recommendation.smallestMeetingTargetIndex).toBeNull();
    expect(r.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['outage-above-model-range', 'target-not-met']));
  });

  it('a target above 99.999 % is beyond the model range: warned, not met', () => {
    const r = dishTradeoff(demoScenario({ dishes: [{ diameterM: 4.5, efficiency: 0.7 }], targetAvailabilityPercent: 99.9995 }));
    expect(r.options[0].meetsTarget).toBe(false);
    expect(r.warnings.map((w) => w.code)).toContain('target-beyond-model-range');
  });

  it('elevation below 5°: computed with a warning; below the horizon: typed error, nothing computed', () => {
    const low = dishTradeoff(demoScenario({ site: { latDeg: 77, lonDeg: 0, altitudeKm: 0 }, satellite: { longitudeDeg: 0 } }));
    expect(low.elevationDeg).toBeLessThan(5);
    expect(low.elevationDeg).toBeGreaterThan(0);
    expect(low.warnings.map((w) => w.code)).toContain('low-elevation');
    expectEngineError(() => dishTradeoff(demoScenario({ satellite: { longitudeDeg: 120 } })), 'satellite.longitudeDeg', /below the horizon/);
  });

  it('no rain at all: zero fade, every closing dish below the model range, never NaN', () => {
    const r = dishTradeoff(demoScenario({ rain: { r001MmH: 0, rainHeightKm: 3 } }));
    expect(r.rainAttenuation001Db).toBe(0);
    expect(r.options.every((o) => o.outageBound === 'below-model-range' && Number.isFinite(o.outagePercent))).toBe(true);
    expect(r.warnings.map((w) => w.code)).toContain('no-rain-fade');
  });

  const base = demoScenario();
  it.each<[string, string, TradeoffScenario]>([
    ['NaN latitude', 'site.latDeg', { ...base, site: { ...base.site, latDeg: Number.NaN } }],
    ['negative diameter', 'dishes[0].diameterM', { ...base, dishes: [{ diameterM: -0.9, efficiency: 0.65 }] }],
    ['NaN efficiency on the third dish', 'dishes[2].efficiency', { ...base, dishes: [base.dishes[0], base.dishes[1], { diameterM: 1, efficiency: Number.NaN }] }],
    ['frequency 60 GHz', 'downlink.frequencyGHz', { ...base, downlink: { ...base.downlink, frequencyGHz: 60 } }],
    ['frequency 0.5 GHz', 'downlink.frequencyGHz', { ...base, downlink: { ...base.downlink, frequencyGHz: 0.5 } }],
    ['zero symbol rate', 'downlink.symbolRateMsps', { ...base, downlink: { ...base.downlink, symbolRateMsps: 0 } }],
    ['NaN EIRP', 'downlink.eirpDbw', { ...base, downlink: { ...base.downlink, eirpDbw: Number.NaN } }],
    ['negative LNB temperature', 'receiver.lnbNoiseTempK', { ...base, receiver: { lnbNoiseTempK: -5, antennaNoiseTempK: 30 } }],
    ['no dishes', 'dishes', { ...base, dishes: [] }],
    ['bad price', 'dishes[0].priceUsd', { ...base, dishes: [{ diameterM: 1, efficiency: 0.6, priceUsd: '12,50' }] }],
    ['negative labour', 'dishes[0].labourUsd', { ...base, dishes: [{ diameterM: 1, efficiency: 0.6, labourUsd: -3 }] }],
    ['two rain sources', 'rain', { ...base, rain: { r001MmH: 30, climateZone: 'K' } as unknown as TradeoffScenario['rain'] }],
    ['negative R0.01', 'rain.r001MmH', { ...base, rain: { r001MmH: -1 } }],
    ['unknown zone', 'rain.climateZone', { ...base, rain: { climateZone: 'I' as 'K' } }],
    ['short monthly list', 'rain.monthlyRainfallMm', { ...base, rain: { monthlyRainfallMm: [1, 2], monthlyTemperatureC: new Array(12).fill(10) } }],
    ['target over 100', 'targetAvailabilityPercent', { ...base, targetAvailabilityPercent: 101 }],
    ['unknown MODCOD', 'acm.modcods[0]', { ...base, acm: { modcods: ['QPSK 7/8'] } }],
    ['uplink with both EIRP and HPA', 'uplink.terminalEirpDbw', { ...base, uplink: { frequencyGHz: 14, tiltDeg: 0, terminalEirpDbw: 45, hpaPowerW: 2, satelliteGOverTDbK: 2, symbolRateMsps: 1, requiredEsN0Db: 2 } }],
    ['uplink frequency 80 GHz', 'uplink.frequencyGHz', { ...base, uplink: { frequencyGHz: 80, tiltDeg: 0, terminalEirpDbw: 45, satelliteGOverTDbK: 2, symbolRateMsps: 1, requiredEsN0Db: 2 } }],
    ['NaN N_wet', 'scintillation.nWet', { ...base, scintillation: { nWet: Number.NaN } }],
  ])('%s → EngineInputError naming %s', (_label, field, scenario) => {
    expectEngineError(() => dishTradeoff(scenario), field);
  });
});
