import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { REFERENCE_COPY_DIR, sharedReferenceDir } from './reference-csv';

/**
 * The repository keeps a verbatim copy of ../shared/reference (the ITU-R SG 3 validation figures,
 * ETSI EN 302 307-1 MODCODs and P.837-1 zones named in its README) so that any clone can run the
 * engine checks. Where the shared folder sits beside the clone, the copy must equal it byte for byte.
 */
const shared = sharedReferenceDir();
const csvs = fs.readdirSync(REFERENCE_COPY_DIR).filter((f) => f.endsWith('.csv')).sort();

describe('the reference copy in tests/fixtures/reference', () => {
  it('holds every reference table', () => {
    expect(csvs).toEqual([
      'dvb-s2-modcods.csv',
      'itu-p1510-1-annual-temperature.csv',
      'itu-p1511-1-topographic-height.csv',
      'itu-p453-14-nwet.csv',
      'itu-p618-13-total-attenuation.csv',
      'itu-p618-rain-attenuation.csv',
      'itu-p618-scintillation.csv',
      'itu-p676-12-gas-attenuation.csv',
      'itu-p676-12-oxygen-lines.csv',
      'itu-p676-12-specific-attenuation.csv',
      'itu-p676-12-water-vapour-lines.csv',
      'itu-p836-6-surface-vapour-density.csv',
      'itu-p836-6-water-vapour-content.csv',
      'itu-p837-1-climate-zones.csv',
      'itu-p837-7-monthly-climate.csv',
      'itu-p837-7-rain-rate.csv',
      'itu-p838-3-specific-attenuation.csv',
      'itu-p839-4-rain-height.csv',
      'itu-p840-8-cloud-attenuation.csv',
      'itu-p840-8-reduced-cloud-liquid.csv',
    ]);
  });

  it.skipIf(!shared)('equals ../shared/reference byte for byte', () => {
    const sharedCsvs = fs.readdirSync(shared!).filter((f) => f.endsWith('.csv')).sort();
    expect(sharedCsvs).toEqual(csvs);
    for (const f of csvs) {
      expect(fs.readFileSync(path.join(REFERENCE_COPY_DIR, f), 'utf8'), f).toBe(fs.readFileSync(path.join(shared!, f), 'utf8'));
    }
  });

  describe('edge cases', () => {
    it('every copied table has a header and at least one row', () => {
      for (const f of csvs) {
        const lines = fs.readFileSync(path.join(REFERENCE_COPY_DIR, f), 'utf8').trim().split(/\r?\n/);
        expect(lines.length, f).toBeGreaterThan(1);
      }
    });
  });
});
