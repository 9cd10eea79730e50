import { describe, expect, it } from 'vitest';
import { EngineInputError, RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4, latitudeIsothermHeight, rainHeightFromIsotherm, resolveRainHeight } from '@/server/engine';
import { readReferenceCsv, num } from './reference-csv';

// ITU-R P.839-4 eq. (1): h_R = h_0 + 0.36 km. The latitude rule for h_0 is that of the older
// P.839 editions as server/engine/README.md §1 states it (values from memory); results from it are labelled
// 'latitude-approximation'.
describe('rain height (ITU-R P.839-4)', () => {
  it('h_R = h_0 + 0.36 km', () => {
    expect(RAIN_HEIGHT_ABOVE_ISOTHERM_KM_P839_4).toBe(0.36);
    expect(rainHeightFromIsotherm({ zeroIsothermHeightKm: 4.5 })).toBeCloseTo(4.86, 12);
  });

  it('the P.618 reference rain heights are h_0 + 0.36 with a plausible h_0 (ITU-R SG 3 validation examples, P.839-4 values)', () => {
    for (const row of readReferenceCsv('itu-p618-rain-attenuation.csv')) {
      const h0 = num(row, 'rain_height_km') - 0.36;
      expect(h0).toBeGreaterThan(1.5);
      expect(h0).toBeLessThan(5.5);
    }
  });

  it.each([
    [0, 5],
    [23, 5],
    [51.5, 5 - 0.075 * 28.5],
    [-21, 5],
    [-30, 5 - 0.1 * 9],
    [-71, 0],
    [-80, 0],
  ])('latitude approximation at %s° gives h_0 = %s km (older P.839 rule, from memory)', (lat, h0) => {
    expect(latitudeIsothermHeight({ latDeg: lat })).toBeCloseTo(h0, 12);
  });

  it('resolveRainHeight prefers a given h_R, then h_0, then the labelled approximation', () => {
    expect(resolveRainHeight({ latDeg: 40, rainHeightKm: 3.1, zeroIsothermHeightKm: 9 })).toEqual({ rainHeightKm: 3.1, zeroIsothermHeightKm: null, source: 'given' });
    expect(resolveRainHeight({ latDeg: 40, zeroIsothermHeightKm: 3 })).toEqual({ rainHeightKm: 3.36, zeroIsothermHeightKm: 3, source: 'zero-isotherm' });
    const approx = resolveRainHeight({ latDeg: 40 });
    expect(approx.source).toBe('latitude-approximation');
    expect(approx.rainHeightKm).toBeCloseTo(5 - 0.075 * 17 + 0.36, 12);
  });
});

describe('edge cases', () => {
  it('the far north never gets a negative isotherm height', () => {
    expect(latitudeIsothermHeight({ latDeg: 90 })).toBeGreaterThanOrEqual(0);
  });
  it('bad heights and latitudes throw EngineInputError naming the field (with the caller prefix)', () => {
    expect(() => latitudeIsothermHeight({ latDeg: 95 })).toThrow(EngineInputError);
    try {
      resolveRainHeight({ latDeg: 40, rainHeightKm: Number.NaN, fieldPrefix: 'rain.' });
      expect.unreachable();
    } catch (e) {
      expect((e as EngineInputError).field).toBe('rain.rainHeightKm');
    }
    expect(() => rainHeightFromIsotherm({ zeroIsothermHeightKm: 30 })).toThrowError(/zeroIsothermHeightKm/);
  });
});
