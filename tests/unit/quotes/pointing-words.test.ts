import { describe, expect, it } from 'vitest';
import { siteAndServiceInWords } from '@/server/quotes/present';
import { magneticDeclination } from '@/server/pointing/magnetic-declination';

// Demo-style invented site; the declination itself is checked against the WMM2025 test values in tests/unit/pointing.
const snapshot = {
  computedAt: '2027-07-02T12:00:00.000Z',
  site: { name: 'Long barn roof', customerName: 'Fenwold Farm', latDeg: 62, lonDeg: 53, altitudeM: 0 },
  service: { name: 'TV bouquet', satelliteName: 'Testbird-1', satelliteLongitudeDeg: -19.5, transmits: false },
  pointing: { azimuthDeg: 200, elevationDeg: 20, polarizationSkewDeg: 0 },
};

describe('quote pointing words', () => {
  it('give the compass bearing and the WMM2025 declination beside the true azimuth', () => {
    const d = magneticDeclination(62, 53, 0, new Date(snapshot.computedAt)).declinationDeg;
    expect(d).toBeGreaterThan(10); // east declination there (test file: 19.39° E at 8 km, 2027.5)
    const words = siteAndServiceInWords(snapshot as never).pointing;
    expect(words).toContain('200.0° from true north');
    expect(words).toContain(`${(200 - d).toFixed(1)}° on a compass`);
    expect(words).toMatch(/magnetic declination \d+\.\d° E, WMM2025/);
  });
});
