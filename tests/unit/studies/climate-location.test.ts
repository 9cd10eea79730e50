import { describe, expect, it } from 'vitest';
import { climatePlaceOf, climatePlaceWarning, greatCircleKm, PROFILE_FAR_FROM_SITE_KM } from '@/server/studies/climate-location';

// Great-circle distances worked by hand on a sphere of radius 6371.0088 km (IUGG mean radius R1):
// one degree of a great circle is 2π·6371.0088/360 = 111.19508 km.
const KM_PER_DEG = (2 * Math.PI * 6371.0088) / 360;

describe('greatCircleKm', () => {
  it('one degree along the equator or a meridian is 111.195 km', () => {
    expect(greatCircleKm({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 1 })).toBeCloseTo(KM_PER_DEG, 6);
    expect(greatCircleKm({ latDeg: 48, lonDeg: -21 }, { latDeg: 49, lonDeg: -21 })).toBeCloseTo(KM_PER_DEG, 6);
  });

  it('between two points of one parallel it agrees with the spherical law of cosines, a little short of the parallel arc', () => {
    // cos Δσ = sin²φ + cos²φ cos Δλ; the arc along the 60° parallel itself is cos 60° · 111.195 km.
    const rad = Math.PI / 180;
    const sigma = Math.acos(Math.sin(60 * rad) ** 2 + Math.cos(60 * rad) ** 2 * Math.cos(1 * rad));
    const d = greatCircleKm({ latDeg: 60, lonDeg: 0 }, { latDeg: 60, lonDeg: 1 });
    expect(d).toBeCloseTo(sigma * 6371.0088, 6);
    expect(d).toBeLessThan(0.5 * KM_PER_DEG);
  });

  // Edge cases: the same point, antipodes, the date line.
  it('is 0 for one point, half the circumference for antipodes, and short across the date line', () => {
    expect(greatCircleKm({ latDeg: 12, lonDeg: 34 }, { latDeg: 12, lonDeg: 34 })).toBe(0);
    // Haversine loses a few metres next to the antipode (asin near 1): to the kilometre that is exact.
    expect(greatCircleKm({ latDeg: 10, lonDeg: 20 }, { latDeg: -10, lonDeg: -160 })).toBeCloseTo(180 * KM_PER_DEG, 2);
    expect(greatCircleKm({ latDeg: 0, lonDeg: 179.5 }, { latDeg: 0, lonDeg: -179.5 })).toBeCloseTo(KM_PER_DEG, 6);
  });
});

describe('climatePlaceOf and its warning', () => {
  const site = { latDeg: 48.612, lonDeg: -21.847 };

  it('a profile made nearby is "near", with the distance, and gives no warning', () => {
    const place = climatePlaceOf(site, { kind: 'known-r001', location: { latDeg: 48.65, lonDeg: -21.8 } });
    expect(place?.kind).toBe('near');
    expect(climatePlaceWarning('Ottermere hills', place)).toBeNull();
  });

  it('a profile made more than 100 km away warns and states the distance', () => {
    // 1.5° of latitude north of the site: 166.79 km.
    const place = climatePlaceOf(site, { kind: 'monthly-normals', location: { latDeg: 50.112, lonDeg: -21.847 } });
    expect(place).toEqual({ kind: 'far', distanceKm: expect.closeTo(1.5 * KM_PER_DEG, 6) });
    expect(climatePlaceWarning('Brindlewick normals', place)).toMatch(/“Brindlewick normals” was made for a place 167 km from this site \(more than 100 km\)/);
  });

  it('just inside and just outside 100 km', () => {
    const deg = PROFILE_FAR_FROM_SITE_KM / KM_PER_DEG;
    expect(climatePlaceOf({ latDeg: 0, lonDeg: 0 }, { kind: 'known-r001', location: { latDeg: deg * 0.999, lonDeg: 0 } })?.kind).toBe('near');
    expect(climatePlaceOf({ latDeg: 0, lonDeg: 0 }, { kind: 'known-r001', location: { latDeg: deg * 1.001, lonDeg: 0 } })?.kind).toBe('far');
  });

  it('a profile with no place stored warns of an unknown place', () => {
    const place = climatePlaceOf(site, { kind: 'climate-zone', location: null });
    expect(place).toEqual({ kind: 'unknown' });
    expect(climatePlaceWarning('Zone K', place)).toMatch(/made for an unknown place/);
  });

  // Edge cases: the maps are read at the site; an older snapshot recorded no place and stays silent.
  it('says nothing for the ITU-R maps or for studies made before places were recorded', () => {
    expect(climatePlaceOf(site, { kind: 'itu-r-maps', location: undefined })).toBeNull();
    expect(climatePlaceOf(site, { kind: 'known-r001' })).toBeNull();
    expect(climatePlaceWarning('x', null)).toBeNull();
  });
});
