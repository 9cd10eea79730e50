import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { siteClimate } from '@/server/climate-maps';
import { callersAt, SPREAD } from './site-maps-callers';

/** The callers' outputs before they shared one map reader (capture-site-maps-callers.ts, run on the old code). */
const before = JSON.parse(readFileSync(join(__dirname, 'fixtures', 'site-maps-callers.json'), 'utf8')) as Record<string, Record<string, unknown>>;

describe('a study, a campaign row and the trade-off API read the ITU-R maps at a site as they did before', () => {
  for (const s of SPREAD) {
    it(`${s.why} (${s.latDeg}°, ${s.lonDeg}°): every output identical, altitude given or the P.1511-1 default, errors included`, () => {
      const now = callersAt(s.latDeg, s.lonDeg);
      const then = before[`${s.latDeg},${s.lonDeg}`];
      expect(Object.keys(now)).toEqual(Object.keys(then));
      for (const key of Object.keys(then)) expect(now[key], key).toEqual(then[key]);
    });
  }

  it('a campaign row without altitude agrees with the maps read on their own (P.1511-1 to 1 m, P.837-7 R0.01)', () => {
    const mid = callersAt(47.25, 2.5)['campaign.maps'] as { ok: { results: { siteRef: string; climate: { altitudeM: number; r001MmH: number } }[] } };
    const blank = mid.ok.results.find((r) => r.siteRef === 'BLANK')!;
    const c = siteClimate({ latDeg: 47.25, lonDeg: 2.5 });
    expect(blank.climate.altitudeM).toBe(Math.round(c.topographicHeightKm * 1000));
    expect(blank.climate.r001MmH).toBe(c.r001MmH);
  });
});
