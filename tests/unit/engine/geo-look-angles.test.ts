import { describe, expect, it } from 'vitest';
import { EngineInputError, geoLookAngles } from '@/server/engine';

// No published look-angle table is at hand: checks use the textbook closed forms for a
// spherical Earth (elevation tan E = (cos γ − R_E/r_s)/sin γ with cos γ = cos φ cos Δλ; range by
// the cosine rule) — common geometry, no ITU source — plus symmetry laws.
const RE = 6378.137;
const RS = 42164;
const D = Math.PI / 180;

function closedForm(latDeg: number, dLonDeg: number) {
  const cg = Math.cos(latDeg * D) * Math.cos(dLonDeg * D);
  const sg = Math.sqrt(1 - cg * cg);
  return { elevationDeg: Math.atan2(cg - RE / RS, sg) / D, rangeKm: Math.sqrt(RE * RE + RS * RS - 2 * RE * RS * cg) };
}

describe('geoLookAngles against the spherical-Earth closed forms (textbook geometry, no ITU source)', () => {
  it.each([
    [51.5, -0.14, 28.2],
    [41.9, 12.49, 13],
    [-33.94, 18.43, -20],
    [22.9, -43.23, -61],
    [64, 25, 5],
    [0.5, 100, 160],
  ])('site %s°, %s° and satellite at %s° E', (lat, lon, sat) => {
    const g = geoLookAngles({ latDeg: lat, lonDeg: lon, altitudeKm: 0, satelliteLongitudeDeg: sat });
    const c = closedForm(lat, sat - lon);
    expect(g.elevationDeg).toBeCloseTo(c.elevationDeg, 9);
    expect(g.rangeKm).toBeCloseTo(c.rangeKm, 6);
  });

  it('a satellite due south of a northern site is at azimuth 180°, skew 0', () => {
    const g = geoLookAngles({ latDeg: 45, lonDeg: 10, altitudeKm: 0, satelliteLongitudeDeg: 10 });
    expect(g.azimuthDeg).toBeCloseTo(180, 10);
    expect(g.polarizationSkewDeg).toBeCloseTo(0, 10);
    expect(g.elevationDeg).toBeCloseTo(closedForm(45, 0).elevationDeg, 10);
  });

  it('a satellite due north of a southern site is at azimuth 0°', () => {
    const g = geoLookAngles({ latDeg: -30, lonDeg: 20, altitudeKm: 0, satelliteLongitudeDeg: 20 });
    expect(g.azimuthDeg).toBeCloseTo(0, 10);
  });

  it('east and west offsets mirror: azimuths 180 ± a, skews ± s (north); satellites east of a northern site lie south-east', () => {
    const e = geoLookAngles({ latDeg: 45, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: 30 });
    const w = geoLookAngles({ latDeg: 45, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: -30 });
    expect(e.azimuthDeg).toBeGreaterThan(90);
    expect(e.azimuthDeg).toBeLessThan(180);
    expect(e.azimuthDeg + w.azimuthDeg).toBeCloseTo(360, 9);
    expect(e.polarizationSkewDeg).toBeCloseTo(-w.polarizationSkewDeg, 9);
    expect(e.elevationDeg).toBeCloseTo(w.elevationDeg, 12);
  });

  it('skew is close to the common far-satellite approximation atan(sin Δλ / tan φ) in size (within 0.5°)', () => {
    for (const [lat, dl] of [[45, 30], [51.5, 28.34], [-33.9, -38.4], [30, 10]]) {
      const g = geoLookAngles({ latDeg: lat, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: dl });
      const approx = Math.atan(Math.sin(dl * D) / Math.tan(lat * D)) / D;
      expect(Math.abs(Math.abs(g.polarizationSkewDeg) - Math.abs(approx))).toBeLessThan(0.5);
    }
  });

  it('altitude enters as a larger radius: the closed forms with R_E + h still hold (range shorter, elevation a hair lower)', () => {
    const sea = geoLookAngles({ latDeg: 40, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: 20 });
    const hill = geoLookAngles({ latDeg: 40, lonDeg: 0, altitudeKm: 2, satelliteLongitudeDeg: 20 });
    const r = RE + 2;
    const cg = Math.cos(40 * D) * Math.cos(20 * D);
    expect(hill.elevationDeg).toBeCloseTo(Math.atan2(cg - r / RS, Math.sqrt(1 - cg * cg)) / D, 9);
    expect(hill.rangeKm).toBeCloseTo(Math.sqrt(r * r + RS * RS - 2 * r * RS * cg), 6);
    expect(hill.rangeKm).toBeLessThan(sea.rangeKm);
    expect(hill.elevationDeg).toBeLessThan(sea.elevationDeg);
  });
});

describe('edge cases', () => {
  it('satellite at the zenith: elevation 90°, range = orbit radius − Earth radius, skew defined as 0', () => {
    const g = geoLookAngles({ latDeg: 0, lonDeg: 10, altitudeKm: 0, satelliteLongitudeDeg: 10 });
    expect(g.elevationDeg).toBeCloseTo(90, 9);
    expect(g.rangeKm).toBeCloseTo(RS - RE, 6);
    expect(g.polarizationSkewDeg).toBe(0);
    expect(Number.isFinite(g.azimuthDeg)).toBe(true);
  });

  it('a satellite beyond the horizon is reported with a negative elevation (the trade-off refuses it)', () => {
    const g = geoLookAngles({ latDeg: 60, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: 100 });
    expect(g.elevationDeg).toBeLessThan(0);
  });

  it('the poles are finite', () => {
    const g = geoLookAngles({ latDeg: 90, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: 0 });
    expect(Number.isFinite(g.elevationDeg) && Number.isFinite(g.azimuthDeg) && Number.isFinite(g.polarizationSkewDeg)).toBe(true);
  });

  it.each([
    [{ latDeg: 91 }, 'latDeg'],
    [{ lonDeg: Number.NaN }, 'lonDeg'],
    [{ altitudeKm: 20 }, 'altitudeKm'],
    [{ satelliteLongitudeDeg: Number.NEGATIVE_INFINITY }, 'satelliteLongitudeDeg'],
  ])('%o throws EngineInputError naming %s', (patch, field) => {
    try {
      geoLookAngles({ latDeg: 40, lonDeg: 0, altitudeKm: 0, satelliteLongitudeDeg: 20, ...patch });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe(field);
    }
  });
});
