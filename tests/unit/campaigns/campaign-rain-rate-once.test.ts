import { describe, expect, it, vi } from 'vitest';
import { climate as knownR001, SEVEN, service } from './campaign-fixture';

// Count the P.837-7 Annex 1 step (monthly normals → P0 and R0.01) around the real function.
const calls = vi.hoisted(() => ({ n: 0 }));
vi.mock('@/server/engine/p837-7-monthly-climate', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/server/engine/p837-7-monthly-climate')>();
  return { ...real, monthlyRainClimate: (...args: Parameters<typeof real.monthlyRainClimate>) => (calls.n++, real.monthlyRainClimate(...args)) };
});

// The unit project shares modules between files (isolate: false): a file that loaded the engine
// first would hand this one the unmocked module. A fresh copy of the module graph takes the mock.
async function freshComputeCampaign() {
  vi.resetModules();
  return (await import('@/server/campaigns/campaign-compute')).computeCampaign;
}

describe('a campaign row works out its maps R0.01 once', () => {
  // Invented sites: one with its altitude in the file, one without (P.1511-1).
  const rows = [
    { line: 2, siteRef: 'A', latDeg: 47.25, lonDeg: 2.5, altitudeM: 180, currentDishCm: 60 },
    { line: 3, siteRef: 'B', latDeg: 6.2, lonDeg: -1.6, altitudeM: null, currentDishCm: 60 },
  ];

  it('the maps climate goes to the engine as monthly normals: one P.837-7 Annex 1 step per site', async () => {
    const computeCampaign = await freshComputeCampaign();
    calls.n = 0;
    const out = computeCampaign({ rows, service, climate: null, dishes: SEVEN, targetAvailabilityPercent: 99.9 });
    expect(out.results).toHaveLength(2);
    expect(out.results.every((r) => r.climate.r001MmH > 0)).toBe(true);
    expect(calls.n).toBe(2);
  });

  it('an override profile needs none', async () => {
    const computeCampaign = await freshComputeCampaign();
    calls.n = 0;
    const out = computeCampaign({ rows, service, climate: knownR001, dishes: SEVEN, targetAvailabilityPercent: 99.9 });
    expect(out.results.map((r) => r.climate.r001MmH)).toEqual([42, 42]);
    expect(calls.n).toBe(0);
  });
});
