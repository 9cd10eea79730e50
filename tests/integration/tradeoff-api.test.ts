import { apiRequest, asUser } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { POST as tradeoffRoute } from '@/app/api/v1/tradeoff/route';
import { dishTradeoff } from '@/server/engine';
import type { TradeoffScenario } from '@/server/engine/tradeoff-types';
import { siteAtmosphere, siteClimate } from '@/server/climate-maps';
import { createCompany, createUserWithRole, signInAs } from './support/factories';

/**
 * POST /api/v1/tradeoff from coordinates alone: what the request leaves out is read from
 * the ITU-R maps at the site — altitude (P.1511-1), rain climate (P.837-7 Annex 1), rain height
 * (P.839-4), atmosphere (gases, clouds, scintillation) — and checked here against the maps read
 * directly; the explicit climate forms still work; every refusal is a 422 naming the field.
 */
afterAll(closeSequelize);

let installer: string;
beforeAll(async () => {
  const company = await createCompany({ planCode: 'fleet' });
  installer = await signInAs(await createUserWithRole(company.id, 'installer'));
});

const noParams = { params: Promise.resolve({}) };
const post = async (body: unknown) => {
  asUser(installer);
  const res = await tradeoffRoute(apiRequest('/api/v1/tradeoff', { method: 'POST', json: body }), noParams);
  return { status: res.status, body: await res.json() };
};

// Invented service and prices (demo figures); the site is a field in central France.
const LAT = 47.1;
const LON = 2.6;
const coordinatesOnly = {
  site: { latDeg: LAT, lonDeg: LON },
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  dishes: [{ diameterM: 0.6, efficiency: 0.65, priceUsd: '89.00' }, { diameterM: 0.9, efficiency: 0.65, priceUsd: 189 }],
  targetAvailabilityPercent: 99.9,
};
/** The JSON the route sends, for comparing with a direct engine call. */
const asJson = (v: unknown) => JSON.parse(JSON.stringify(v));

describe('POST /api/v1/tradeoff from coordinates alone', () => {
  it('reads altitude, rain climate, rain height and atmosphere from the ITU-R maps; outages on the total attenuation', async () => {
    const { status, body } = await post(coordinatesOnly);
    expect(status).toBe(200);
    const c = siteClimate({ latDeg: LAT, lonDeg: LON });
    expect(body.climateSource.kind).toBe('itu-r-maps');
    expect(body.climateSource.r001MmH).toBe(c.r001MmH);
    expect(body.climateSource.p0Percent).toBe(c.p0Percent);
    expect(body.attenuationModel).toBe('total');
    expect(body.rainHeightKm).toBeCloseTo(c.rainHeightKm, 9);
    expect(body.rainHeightSource).not.toBe('latitude-approximation');
    expect(body.atmosphere.nWetMedian).toBe(c.nWetMedian);

    const altitudeKm = Math.round(c.topographicHeightKm * 1000) / 1000;
    expect(body.mapInputs.filled).toEqual([
      { field: 'site.altitudeKm', source: 'ITU-R P.1511-1 topographic height', value: altitudeKm },
      { field: 'rain', source: expect.stringContaining('P.837-7 Annex 1'), value: null },
      { field: 'rain.zeroIsothermHeightKm', source: 'ITU-R P.839-4', value: c.isothermHeightKm },
      { field: 'atmosphere', source: expect.stringContaining('P.836-6'), value: null },
    ]);
    expect(body.mapInputs.mapVersions).toEqual(expect.arrayContaining(['ITU-R P.837-7', 'ITU-R P.839-4', 'ITU-R P.1511-1', 'ITU-R P.836-6', 'ITU-R P.840-8']));
    expect(body.mapInputs.mapVersions.at(-1)).toMatch(/^maps:/);

    // Every dish that closes carries gas, cloud, rain and scintillation at its outage, and a total.
    for (const o of body.options) {
      expect(o.closes).toBe(true);
      const a = o.attenuationAtOutage;
      expect(a.gasDb).toBeGreaterThan(0);
      expect(a.cloudDb).toBeGreaterThan(0);
      expect(a.rainDb).toBeGreaterThan(0);
      expect(a.totalDb).toBeGreaterThan(a.rainDb);
    }

    // The same scenario assembled by hand from the maps, through the engine: the very same result.
    const byHand: TradeoffScenario = {
      ...coordinatesOnly,
      site: { latDeg: LAT, lonDeg: LON, altitudeKm },
      rain: { monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC, origin: 'itu-r-maps', zeroIsothermHeightKm: c.isothermHeightKm },
      atmosphere: siteAtmosphere({ latDeg: LAT, lonDeg: LON, stationHeightKm: altitudeKm }),
    };
    const { mapInputs, ...result } = body;
    expect(mapInputs).toBeDefined();
    expect(result).toEqual(asJson(dishTradeoff(byHand)));
  });

  it('keeps the caller’s altitude and reads only what is missing', async () => {
    const { status, body } = await post({ ...coordinatesOnly, site: { latDeg: LAT, lonDeg: LON, altitudeKm: 0.35 } });
    expect(status).toBe(200);
    expect(body.mapInputs.filled.map((f: { field: string }) => f.field)).toEqual(['rain', 'rain.zeroIsothermHeightKm', 'atmosphere']);
    const direct = dishTradeoff({
      ...coordinatesOnly,
      site: { latDeg: LAT, lonDeg: LON, altitudeKm: 0.35 },
      rain: { monthlyRainfallMm: siteClimate({ latDeg: LAT, lonDeg: LON }).monthlyRainfallMm, monthlyTemperatureC: siteClimate({ latDeg: LAT, lonDeg: LON }).monthlyTemperatureC, origin: 'itu-r-maps', zeroIsothermHeightKm: siteClimate({ latDeg: LAT, lonDeg: LON }).isothermHeightKm },
      atmosphere: siteAtmosphere({ latDeg: LAT, lonDeg: LON, stationHeightKm: 0.35 }),
    });
    expect(body.options[0].outageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
  });
});

describe('POST /api/v1/tradeoff with an explicit rain climate', () => {
  const site = { latDeg: LAT, lonDeg: LON, altitudeKm: 0.14 };
  const forms: [string, Record<string, unknown>, string][] = [
    ['known R0.01', { r001MmH: 32, zeroIsothermHeightKm: 2.9 }, 'r001'],
    // Invented normals, not from any place.
    ['monthly normals', { monthlyRainfallMm: [61, 52, 55, 63, 78, 64, 58, 60, 57, 72, 70, 66], monthlyTemperatureC: [4, 5, 8, 11, 15, 18, 20, 20, 17, 13, 8, 5], rainHeightKm: 3.1 }, 'monthly-normals'],
    ['measured curve', { measuredCurve: [{ pPercent: 1, rainRateMmH: 2.1 }, { pPercent: 0.1, rainRateMmH: 9 }, { pPercent: 0.01, rainRateMmH: 31 }, { pPercent: 0.001, rainRateMmH: 70 }], zeroIsothermHeightKm: 2.9 }, 'measured-curve'],
    ['climate zone', { climateZone: 'H', zeroIsothermHeightKm: 2.9 }, 'climate-zone'],
  ];

  for (const [name, rain, kind] of forms) {
    it(`${name}: the caller’s climate, the atmosphere from the maps, the same result as the engine`, async () => {
      const { status, body } = await post({ ...coordinatesOnly, site, rain });
      expect(status).toBe(200);
      expect(body.climateSource.kind).toBe(kind);
      expect(body.attenuationModel).toBe('total');
      expect(body.mapInputs.filled.map((f: { field: string }) => f.field)).toEqual(['atmosphere']);
      const { mapInputs: _m, ...result } = body;
      expect(result).toEqual(asJson(dishTradeoff({ ...coordinatesOnly, site, rain: rain as unknown as TradeoffScenario["rain"], atmosphere: siteAtmosphere({ ...site, stationHeightKm: site.altitudeKm }) })));
    });
  }

  it('atmosphere: null gives the rain-only figures, exactly the engine’s, with nothing read from the maps', async () => {
    const scenario = { ...coordinatesOnly, site, rain: { r001MmH: 32, zeroIsothermHeightKm: 2.9 } };
    const { status, body } = await post({ ...scenario, atmosphere: null });
    expect(status).toBe(200);
    expect(body.attenuationModel).toBe('rain');
    expect(body.options[0].attenuationAtOutage).toBeNull();
    expect(body.mapInputs).toEqual({ filled: [], mapVersions: [] });
    const { mapInputs: _m, ...result } = body;
    expect(result).toEqual(asJson(dishTradeoff(scenario)));
  });

  it('a climate without a rain height gets the P.839-4 isotherm of the maps, not the latitude approximation', async () => {
    const { body } = await post({ ...coordinatesOnly, site, rain: { r001MmH: 32 }, atmosphere: null });
    const h0 = siteClimate({ latDeg: LAT, lonDeg: LON }).isothermHeightKm;
    expect(body.mapInputs.filled).toEqual([{ field: 'rain.zeroIsothermHeightKm', source: 'ITU-R P.839-4', value: h0 }]);
    expect(body.rainHeightKm).toBeCloseTo(h0 + 0.36, 9);
    expect(body.warnings.map((w: { code: string }) => w.code)).not.toContain('rain-height-approximation');
  });
});

describe('POST /api/v1/tradeoff refusals: 422 naming the field, never a 500 or a number', () => {
  const fieldsOf = (body: { error: { fieldErrors?: Record<string, string[]> } }) => Object.keys(body.error.fieldErrors ?? {});

  it('a site without map data (88.9° N, 100° E) names site.latDeg', async () => {
    const { status, body } = await post({ ...coordinatesOnly, site: { latDeg: 88.9, lonDeg: 100 } });
    expect(status).toBe(422);
    expect(fieldsOf(body)).toEqual(['site.latDeg']);
    expect(body.error.message).toMatch(/no ITU-R map data/);
  });

  it('a satellite below the site’s horizon names satellite.longitudeDeg', async () => {
    const { status, body } = await post({ ...coordinatesOnly, satellite: { longitudeDeg: 150 } });
    expect(status).toBe(422);
    expect(fieldsOf(body)).toEqual(['satellite.longitudeDeg']);
    expect(body.error.message).toMatch(/below the horizon/);
  });

  it('absurd values are refused by the schema’s physical ranges, each naming its field', async () => {
    const cases: [unknown, string][] = [
      [{ ...coordinatesOnly, dishes: [{ diameterM: 1e308, efficiency: 0.65 }] }, 'dishes.0.diameterM'],
      [{ ...coordinatesOnly, dishes: [{ diameterM: 0.05, efficiency: 0.65 }] }, 'dishes.0.diameterM'],
      [{ ...coordinatesOnly, dishes: [{ diameterM: 0.6, efficiency: 1.2 }] }, 'dishes.0.efficiency'],
      [{ ...coordinatesOnly, dishes: [{ diameterM: 0.6, efficiency: 0.65, priceUsd: 20_000_000 }] }, 'dishes.0.priceUsd'],
      [{ ...coordinatesOnly, dishes: [{ diameterM: 0.6, efficiency: 0.65, labourUsd: '95.005' }] }, 'dishes.0.labourUsd'],
      [{ ...coordinatesOnly, downlink: { ...coordinatesOnly.downlink, eirpDbw: 500 } }, 'downlink.eirpDbw'],
      [{ ...coordinatesOnly, downlink: { ...coordinatesOnly.downlink, tiltDeg: 1e308 } }, 'downlink.tiltDeg'],
      [{ ...coordinatesOnly, downlink: { ...coordinatesOnly.downlink, frequencyGHz: 90 } }, 'downlink.frequencyGHz'],
      [{ ...coordinatesOnly, site: { latDeg: LAT, lonDeg: LON, altitudeKm: 40 } }, 'site.altitudeKm'],
      [{ ...coordinatesOnly, rain: { monthlyRainfallMm: Array(12).fill(1e6), monthlyTemperatureC: Array(12).fill(20) } }, 'rain.monthlyRainfallMm.0'],
      [{ ...coordinatesOnly, atmosphere: { surfaceTemperatureK: 290 } }, 'atmosphere'],
    ];
    for (const [body, field] of cases) {
      const res = await post(body);
      expect(res.status, field).toBe(422);
      expect(fieldsOf(res.body), field).toContain(field);
    }
  });

  it('a value only the engine can judge is its 422, naming the field (a measured curve that stops short of 0.01 %)', async () => {
    const { status, body } = await post({ ...coordinatesOnly, rain: { measuredCurve: [{ pPercent: 1, rainRateMmH: 2 }, { pPercent: 0.1, rainRateMmH: 9 }] } });
    expect(status).toBe(422);
    expect(fieldsOf(body)).toEqual(['rain.measuredCurve']);
  });
});
