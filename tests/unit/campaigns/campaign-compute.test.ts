import { describe, expect, it } from 'vitest';
import { dishTradeoff } from '@/server/engine';
import { buildScenario } from '@/server/studies/build-scenario';
import { computeCampaign } from '@/server/campaigns/campaign-compute';
import { parseCampaignCsv } from '@/server/campaigns/campaign-csv';
import { campaignResultCsv } from '@/server/campaigns/campaign-result-csv';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot } from '@/server/studies/snapshot';

// Invented satellite, climate, sites and prices (demo data).
const service: ServiceSnapshot = {
  id: 1, name: 'Corvid TV', satelliteName: 'Corvid-2', satelliteLongitudeDeg: -19.5, downlinkFrequencyGHz: 11.8, polarization: 'linear-vertical',
  polarizationTiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, modcod: '8PSK 3/4', requiredEsN0Db: 7.91, implementationMarginDb: 1, otherLossesDb: 0.3,
  lnbNoiseTempK: 60, antennaNoiseTempK: 40, uplink: null, acmModcods: null,
};
const climate: ClimateSnapshot = { id: 1, name: 'Known', kind: 'known-r001', data: { r001MmH: 42 }, zeroIsothermKm: 3.2, sourceNote: 'invented' };
const dish = (cm: number, price: string): DishSnapshot => ({ dishId: cm, name: `D${cm}`, diameterM: cm / 100, efficiency: 0.65, hardwarePrice: price, labourPrice: '90.00', mountNotes: null });
const SEVEN = [dish(45, '59.00'), dish(60, '89.00'), dish(75, '129.00'), dish(90, '189.00'), dish(100, '239.00'), dish(120, '329.00'), dish(150, '489.00')];
const HEADER = 'site_ref,latitude,longitude,altitude_m,current_dish_cm';

describe('computeCampaign', () => {
  const target = 99.9;
  const file = `${HEADER}\nA,47.25,2.5,180,45\nB,47.25,2.5,180,150\nC,47.25,2.5,180,80\nD,-70,170,10,60\nE,46.5,3.1,220,60\n`;
  const parsed = parseCampaignCsv(file);
  const out = computeCampaign({ rows: parsed.rows, service, climate, dishes: SEVEN, targetAvailabilityPercent: target, rowCount: parsed.rowCount });

  it('agrees with a direct dishTradeoff on the same scenario for an upgraded site', () => {
    const a = out.results.find((r) => r.siteRef === 'A')!;
    const direct = dishTradeoff(buildScenario({ site: { id: null, name: 'A', customerId: null, customerName: '', latDeg: 47.25, lonDeg: 2.5, altitudeM: 180 }, service, climate, dishes: SEVEN, targetAvailabilityPercent: target }).scenario);
    const rec = direct.recommendation.smallestMeetingTargetIndex!;
    expect(rec).toBeGreaterThan(0);
    expect(a.verdict).toBe('upgrade');
    expect(a.currentOutageMinutesPerYear).toBe(direct.options[0].outageMinutesPerYear);
    expect(a.currentAvailabilityPercent).toBe(direct.options[0].availabilityPercent);
    expect(a.recommendedDishCm).toBe(Math.round(direct.options[rec].diameterM * 100));
    expect(a.recommendedOutageMinutesPerYear).toBe(direct.options[rec].outageMinutesPerYear);
    expect(a.minutesSavedPerYear).toBeCloseTo(direct.options[0].outageMinutesPerYear - direct.options[rec].outageMinutesPerYear, 9);
    expect(a.upgradePriceUsd).toBe(direct.options[rec].priceUsd);
  });

  it('says so when the current dish already meets the target, and lists the other problems by line', () => {
    expect(out.results.find((r) => r.siteRef === 'B')!.verdict).toBe('already-meets-target');
    expect(out.problems.map((p) => p.line)).toEqual([4, 5]);
    expect(out.problems[0].message).toContain('no active catalogue dish is 80 cm');
    expect(out.problems[1].message).toContain('below the horizon');
    expect(out.counts).toMatchObject({ rows: 5, computed: 3, problems: 2 });
  });

  it('says no dish meets an unreachable target', () => {
    const tight = computeCampaign({ rows: parsed.rows.slice(0, 1), service: { ...service, eirpDbw: 40 }, climate, dishes: SEVEN.slice(0, 2), targetAvailabilityPercent: 99.999 });
    expect(tight.results[0].verdict).toBe('none-meets-target');
    expect(tight.results[0].upgradePriceUsd).toBeNull();
  });

  it('computes 5 000 sites × 7 dishes in under 3 s (measured; printed for the report)', () => {
    const lines = Array.from({ length: 5000 }, (_, i) => `S${i},${(40 + (i % 150) / 10).toFixed(3)},${(-5 + (i % 97) / 10).toFixed(3)},${(i * 7) % 900},${[45, 60, 75, 90][i % 4]}`);
    const text = `${HEADER}\n${lines.join('\n')}\n`;
    // Parse + engine + result CSV: the pure work of one request (the database reads are three small queries).
    const t0 = performance.now();
    const big = parseCampaignCsv(text);
    const t1 = performance.now();
    const r = computeCampaign({ rows: big.rows, service, climate, dishes: SEVEN, targetAvailabilityPercent: target });
    const t2 = performance.now();
    const csv = campaignResultCsv(r.results, r.problems);
    const ms = performance.now() - t0;
    console.log(`campaign timing: 5000 rows x 7 dishes in ${ms.toFixed(0)} ms (parse ${(t1 - t0).toFixed(0)}, engine ${(t2 - t1).toFixed(0)}, CSV ${(performance.now() - t2).toFixed(0)}; ${Buffer.byteLength(text)} bytes in)`);
    expect(big.rows).toHaveLength(5000);
    expect(r.counts.computed).toBe(5000);
    expect(csv.split('\r\n')).toHaveLength(5001);
    expect(ms).toBeLessThan(3000);
  });
});
