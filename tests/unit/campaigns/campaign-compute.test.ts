import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { dishTradeoff } from '@/server/engine';
import { siteClimate } from '@/server/climate-maps';
import { buildScenario } from '@/server/studies/build-scenario';
import { mapsAtmosphere, mapsAltitudeM, mapsClimateSnapshot } from '@/server/studies/maps-climate';
import { assumedCurrentDishName, computeCampaign, CURRENT_DISH_DEFAULT_EFFICIENCY } from '@/server/campaigns/campaign-compute';
import { parseCampaignCsv } from '@/server/campaigns/campaign-csv';
import { CAMPAIGN_RESULT_HEADER, campaignResultCsv } from '@/server/campaigns/campaign-result-csv';
import { bigCampaignCsv, climate as knownR001, HEADER, SEVEN, service } from './campaign-fixture';

const siteAt = (name: string, latDeg: number, lonDeg: number, altitudeM: number) => ({ id: null, name, customerId: null, customerName: '', latDeg, lonDeg, altitudeM });

describe('computeCampaign: each site with its own climate from the ITU-R maps', () => {
  const target = 99.9;
  // Invented site references; coordinates spread over places with very different rain.
  const file = `${HEADER}\nA,47.25,2.5,180,45\nB,47.25,2.5,180,150\nC,47.25,2.5,180,80\nD,-70,170,10,60\nE,6.2,-1.6,,45\nF,88.9,100,0,60\n`;
  const parsed = parseCampaignCsv(file);
  const out = computeCampaign({ rows: parsed.rows, service, climate: null, dishes: SEVEN, targetAvailabilityPercent: target, rowCount: parsed.rowCount });
  const row = (ref: string) => out.results.find((r) => r.siteRef === ref)!;

  it('agrees with a direct dishTradeoff on the site’s own maps climate and atmosphere', () => {
    const a = row('A');
    const direct = dishTradeoff(
      buildScenario({ site: siteAt('A', 47.25, 2.5, 180), service, climate: mapsClimateSnapshot(47.25, 2.5), dishes: SEVEN, targetAvailabilityPercent: target, atmosphere: mapsAtmosphere(47.25, 2.5, 0.18) }).scenario,
    );
    expect(direct.attenuationModel).toBe('total');
    const rec = direct.recommendation.smallestMeetingTargetIndex!;
    expect(rec).toBeGreaterThan(0);
    expect(a.verdict).toBe('upgrade');
    expect(a.attenuationModel).toBe('total');
    expect(a.currentOutageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
    expect(a.currentAvailabilityPercent).toBe(direct.options[0].availabilityPercent);
    expect(a.currentAttenuation).toEqual(direct.options[0].attenuationAtOutage);
    expect(a.recommendedDishCm).toBe(Math.round(direct.options[rec].diameterM * 100));
    expect(a.recommendedOutageMinutesPerYear).toBe(direct.options[rec].outageMinutesPerYear);
    expect(a.minutesSavedPerYear).toBeCloseTo(direct.options[0].outageMinutesPerYear - direct.options[rec].outageMinutesPerYear, 9);
    expect(a.upgradePriceUsd).toBe(direct.options[rec].priceUsd);
    const c = siteClimate({ latDeg: 47.25, lonDeg: 2.5 });
    expect(a.climate).toEqual({
      r001MmH: c.r001MmH,
      rainClimateSource: 'ITU-R maps at the site (P.837-7 Annex 1)',
      rainHeightKm: expect.closeTo(c.rainHeightKm, 9),
      rainHeightSource: 'ITU-R maps at the site (P.839-4)',
      altitudeM: 180,
      altitudeSource: 'file',
    });
  });

  it('a row without altitude takes the P.1511-1 height, and a tropical site its own (much heavier) rain', () => {
    const e = row('E');
    expect(e.climate.altitudeSource).toBe('ITU-R P.1511-1');
    expect(e.climate.altitudeM).toBe(mapsAltitudeM(6.2, -1.6));
    expect(e.climate.r001MmH).toBe(siteClimate({ latDeg: 6.2, lonDeg: -1.6 }).r001MmH);
    expect(e.climate.r001MmH).toBeGreaterThan(2 * row('A').climate.r001MmH);
    expect(e.currentOutageMinutesPerYear).toBeGreaterThan(row('A').currentOutageMinutesPerYear);
  });

  it('computes a current dish not in the catalogue with the stated default efficiency, and lists a satellite below the horizon and a site without map data as problems', () => {
    expect(row('B').verdict).toBe('already-meets-target');
    const c = row('C');
    expect(c.currentDishAssumed).toBe(true);
    expect(c.currentDishCm).toBe(80);
    expect(c.currentDishName).toBe(assumedCurrentDishName(80));
    expect(c.currentDishName).toContain('65 % efficiency assumed');
    // The same site through the engine with an 80 cm dish of CURRENT_DISH_DEFAULT_EFFICIENCY added to the catalogue.
    const withCurrent = [...SEVEN, { dishId: null, name: 'x', diameterM: 0.8, efficiency: CURRENT_DISH_DEFAULT_EFFICIENCY, hardwarePrice: '0.00', labourPrice: '0.00', mountNotes: null }];
    const built = buildScenario({ site: siteAt('C', 47.25, 2.5, 180), service, climate: mapsClimateSnapshot(47.25, 2.5), dishes: withCurrent, targetAvailabilityPercent: target, atmosphere: mapsAtmosphere(47.25, 2.5, 0.18) });
    const direct = dishTradeoff(built.scenario);
    const k = built.dishes.findIndex((d) => d.name === 'x');
    expect(c.currentOutageMinutesPerYear).toBe(direct.options[k].outageMinutesPerYear);
    if (c.verdict === 'upgrade') expect(c.recommendedDishCm!).toBeGreaterThan(80);
    expect(out.problems.map((p) => p.line)).toEqual([5, 7]);
    expect(out.problems[0].message).toContain('below the horizon');
    expect(out.problems[1]).toMatchObject({ line: 7, siteRef: 'F', message: expect.stringMatching(/^Line 7: the ITU-R maps have no climate data at these coordinates/) });
    expect(out.counts).toMatchObject({ rows: 6, computed: 4, problems: 2 });
  });

  it('recommends an upgrade for every 45 cm dish (not in the catalogue) in a rainy place', () => {
    const lines = Array.from({ length: 20 }, (_, i) => `OLD-${i},${(6 + i * 0.05).toFixed(2)},${(-1.6 + i * 0.05).toFixed(2)},,45`);
    const small = parseCampaignCsv(`${HEADER}\n${lines.join('\n')}\n`);
    // A catalogue from 60 cm up: no 45 cm dish in it.
    const r = computeCampaign({ rows: small.rows, service, climate: null, dishes: SEVEN.slice(1), targetAvailabilityPercent: 99.7 });
    expect(r.problems).toEqual([]);
    expect(r.results).toHaveLength(20);
    for (const x of r.results) {
      expect(x.currentDishAssumed).toBe(true);
      expect(x.verdict).toBe('upgrade');
      expect(x.recommendedDishCm!).toBeGreaterThan(45);
      expect(Number(x.upgradePriceUsd)).toBeGreaterThan(0);
    }
  });

  it('writes each row’s climate and the parts of its fade threshold to the CSV', () => {
    const csv = Papa.parse<string[]>(campaignResultCsv(out.results, out.problems).trim()).data;
    const col = (name: (typeof CAMPAIGN_RESULT_HEADER)[number]) => CAMPAIGN_RESULT_HEADER.indexOf(name);
    const a = csv.find((r) => r[1] === 'A')!;
    const e = csv.find((r) => r[1] === 'E')!;
    expect(Number(a[col('r001_mm_h')])).toBeCloseTo(row('A').climate.r001MmH, 1);
    expect(a[col('altitude_source')]).toBe('file');
    expect(e[col('altitude_source')]).toBe('ITU-R P.1511-1 at the site');
    expect(a[col('attenuation_model')]).toBe('total: gases, clouds, rain, scintillation');
    const parts = (['current_outage_gas_db', 'current_outage_cloud_db', 'current_outage_rain_db', 'current_outage_scintillation_db'] as const).map((k) => Number(a[col(k)]));
    expect(parts.every((p) => p > 0)).toBe(true);
    expect(Number(a[col('current_outage_total_db')])).toBeGreaterThan(parts[2]);
  });

  it('a company profile overrides the RAIN climate of every site; gases, clouds and altitude stay each site’s own', () => {
    const over = computeCampaign({ rows: parsed.rows, service, climate: knownR001, dishes: SEVEN, targetAvailabilityPercent: target });
    const a = over.results.find((r) => r.siteRef === 'A')!;
    const e = over.results.find((r) => r.siteRef === 'E')!;
    expect(a.climate.r001MmH).toBe(42);
    expect(e.climate.r001MmH).toBe(42);
    expect(a.climate.rainClimateSource).toBe('climate profile "Known" (override)');
    expect(a.climate.rainHeightSource).toBe('climate profile "Known"');
    expect(a.attenuationModel).toBe('total');
    expect(e.climate.altitudeM).toBe(mapsAltitudeM(6.2, -1.6));
    const direct = dishTradeoff(
      buildScenario({ site: siteAt('A', 47.25, 2.5, 180), service, climate: knownR001, dishes: SEVEN, targetAvailabilityPercent: target, atmosphere: mapsAtmosphere(47.25, 2.5, 0.18) }).scenario,
    );
    expect(a.currentOutageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
  });

  it('says no dish meets an unreachable target', () => {
    const tight = computeCampaign({ rows: parsed.rows.slice(0, 1), service: { ...service, eirpDbw: 40 }, climate: null, dishes: SEVEN.slice(0, 2), targetAvailabilityPercent: 99.999 });
    expect(tight.results[0].verdict).toBe('none-meets-target');
    expect(tight.results[0].upgradePriceUsd).toBeNull();
  });

  // 5 000 sites end to end (queue, workers, rows in MariaDB) are in tests/integration/campaign-jobs.test.ts;
  // here a smaller file keeps the pure project quick while checking every row comes back in file order.
  it('computes a file of 500 sites × 7 dishes, every row, in file order (timing: npm run bench:campaign)', () => {
    const big = parseCampaignCsv(bigCampaignCsv(500));
    const r = computeCampaign({ rows: big.rows, service, climate: null, dishes: SEVEN, targetAvailabilityPercent: target });
    const csv = campaignResultCsv(r.results, r.problems);
    expect(big.rows).toHaveLength(500);
    expect(r.counts.computed).toBe(500);
    expect(r.results.map((x) => x.line)).toEqual(big.rows.map((x) => x.line));
    expect(csv.split('\r\n')).toHaveLength(501);
  }, 120_000);
});
