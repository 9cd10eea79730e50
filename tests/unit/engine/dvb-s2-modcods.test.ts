import { describe, expect, it } from 'vitest';
import { DVB_S2_MODCODS, acmEnvelope, findModcod } from '@/server/engine';
import { num, readReferenceCsv } from './reference-csv';

// Source: ETSI EN 302 307-1, DVB-S2 ideal Es/N0 in AWGN and spectral efficiency per MODCOD
// (normal frame, no pilots). Both the reference file dvb-s2-modcods.csv and the engine's table
// were typed from memory; this test checks they agree row by row.
const SOURCE = 'ETSI EN 302 307-1 (DVB-S2), typed from memory';
const rows = readReferenceCsv('dvb-s2-modcods.csv');

describe(`DVB-S2 MODCOD table against ${SOURCE}`, () => {
  it('has the same 28 MODCODs as the reference file, in order', () => {
    expect(rows).toHaveLength(28);
    expect(DVB_S2_MODCODS.map((m) => m.name)).toEqual(rows.map((r) => r.modcod));
  });

  it.each(rows.map((r) => [r.modcod, r] as const))('%s: spectral efficiency and ideal Es/N0 equal the reference row', (name, row) => {
    const m = findModcod(name);
    expect(m).toBeDefined();
    expect(m!.spectralEfficiencyBitPerSymbol).toBe(num(row, 'spectral_efficiency_bit_per_symbol'));
    expect(m!.idealEsN0Db).toBe(num(row, 'ideal_es_n0_db'));
  });
});

describe('ACM envelope (server/engine/README.md §4)', () => {
  const env = acmEnvelope(DVB_S2_MODCODS);
  it('keeps only MODCODs that beat every more robust one: efficiency and threshold both rise', () => {
    for (let i = 1; i < env.length; i++) {
      expect(env[i].idealEsN0Db).toBeGreaterThanOrEqual(env[i - 1].idealEsN0Db);
      expect(env[i].spectralEfficiencyBitPerSymbol).toBeGreaterThan(env[i - 1].spectralEfficiencyBitPerSymbol);
    }
  });
  it('drops QPSK 8/9 and QPSK 9/10 (8PSK 3/5 needs less Es/N0 for about the same efficiency)', () => {
    const names = env.map((m) => m.name);
    expect(names).not.toContain('QPSK 8/9');
    expect(names).toContain('8PSK 3/5');
    expect(names[0]).toBe('QPSK 1/4');
    expect(names[names.length - 1]).toBe('32APSK 9/10');
  });
});

describe('edge cases', () => {
  it('unknown names return undefined (no fuzzy matching)', () => {
    expect(findModcod('qpsk 1/2')).toBeUndefined();
    expect(findModcod('QPSK 7/8')).toBeUndefined();
  });
  it('an empty set has an empty envelope', () => {
    expect(acmEnvelope([])).toEqual([]);
  });
});
