import { describe, expect, it } from 'vitest';
import { dishTradeoff } from '@/server/engine';
import { buildScenario } from '@/server/studies/build-scenario';
import { computeCampaign } from '@/server/campaigns/campaign-compute';
import { parseCampaignCsv } from '@/server/campaigns/campaign-csv';
import { campaignResultCsv } from '@/server/campaigns/campaign-result-csv';
import { bigCampaignCsv, climate, HEADER, SEVEN, service } from './campaign-fixture';

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

  it('computes a full-size file of 5 000 sites × 7 dishes, every row, in file order (timing: npm run bench:campaign)', () => {
    const big = parseCampaignCsv(bigCampaignCsv(5000));
    const r = computeCampaign({ rows: big.rows, service, climate, dishes: SEVEN, targetAvailabilityPercent: target });
    const csv = campaignResultCsv(r.results, r.problems);
    expect(big.rows).toHaveLength(5000);
    expect(r.counts.computed).toBe(5000);
    expect(csv.split('\r\n')).toHaveLength(5001);
  });
});
