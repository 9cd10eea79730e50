import { describe, expect, it } from 'vitest';
import { acmSummary } from '@/components/study/acm-summary';

const acm = (mbps: number, modcod = '16APSK 3/4') => ({ closes: true, acm: { expectedThroughputMbps: mbps, clearSkyModcod: modcod, clearSkyThroughputMbps: mbps, shares: [], modelRangeLimited: false } });

describe('acmSummary', () => {
  it('says "same" when every dish is within 1 % (133.0–133.5 Mbit/s)', () => {
    const s = acmSummary([acm(133.0), acm(133.3), acm(133.5)]);
    expect(s).toMatchObject({ kind: 'same', minMbps: 133.0, maxMbps: 133.5, clearSkyModcod: '16APSK 3/4' });
  });
  it('asks for a column when the dishes differ by 1 % or more', () => {
    expect(acmSummary([acm(120), acm(133.5)]).kind).toBe('differs');
  });
  it('leaves out dishes that do not close, and reports none without ACM', () => {
    expect(acmSummary([{ closes: false, acm: acm(10).acm }, acm(133), acm(133.2)]).kind).toBe('same');
    expect(acmSummary([{ closes: true, acm: null }]).kind).toBe('none');
  });
});
