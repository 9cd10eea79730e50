import { describe, expect, it } from 'vitest';
import { formatDms, parseCoordinate } from '@/server/validation/coordinates';

// Conversions are plain arithmetic (deg + min/60 + sec/3600); expected values worked by hand.
const ok = (value: number) => ({ ok: true, value });

describe('parseCoordinate: decimal degrees', () => {
  it.each([
    ['51.5', 'lat', 51.5],
    ['-33.25', 'lat', -33.25],
    ['+12', 'lat', 12],
    ['12,75', 'lat', 12.75],
    ['33.25 S', 'lat', -33.25],
    ['S33.25', 'lat', -33.25],
    ['151.2 e', 'lon', 151.2],
    ['0.1275W', 'lon', -0.1275],
    ['-179.999999', 'lon', -179.999999],
    ['90', 'lat', 90],
    ['12.1234567', 'lat', 12.123457],
  ] as const)('%s (%s) → %d', (text, axis, value) => {
    expect(parseCoordinate(text, axis)).toEqual(ok(value));
  });
});

describe('parseCoordinate: degrees, minutes, seconds', () => {
  it.each([
    [`51°28'38"N`, 'lat', 51.477222],
    ['51 28 38 N', 'lat', 51.477222],
    ['N 51° 28′ 38″', 'lat', 51.477222],
    ['51:28:38', 'lat', 51.477222],
    [`33°52'04.5" S`, 'lat', -33.867917],
    [`0°07'39"W`, 'lon', -0.1275],
    ['-0 7 39', 'lon', -0.1275],
    [`12° 30.5' E`, 'lon', 12.508333],
    [`12°30''`, 'lat', 12.5],
    ['12 30', 'lat', 12.5],
    [`12º30'00"N`, 'lat', 12.5],
  ] as const)('%s (%s) → %d', (text, axis, value) => {
    expect(parseCoordinate(text, axis)).toEqual(ok(value));
  });
});

describe('parseCoordinate: clear errors, never a guess', () => {
  it.each([
    ['', 'lat', /required/],
    ['   ', 'lon', /required/],
    ['12 75 0 N', 'lat', /Minutes must be below 60/],
    ['12 30 60', 'lat', /Seconds must be below 60/],
    ['91', 'lat', /between -90 and 90/],
    ['180.5 W', 'lon', /between -180 and 180/],
    ['12.5 E', 'lat', /longitude \(E\/W\) letter/],
    ['12.5 N', 'lon', /latitude \(N\/S\) letter/],
    ['-12.5 S', 'lat', /either a sign or N\/S/],
    ['N 12 S', 'lat', /hemisphere once/],
    ['12.5 30', 'lat', /only the last part/],
    ['twelve', 'lat', /^Latitude: "twelve" is not a number\.$/],
    ['12.5 e', 'lat', /"E" is a longitude \(E\/W\) letter/],
    ['12d30m15s', 'lat', /not a number/],
    ['1 2 3 4', 'lat', /decimal degrees/],
    ['N', 'lat', /decimal degrees/],
  ] as const)('%j (%s) is refused', (text, axis, message) => {
    const r = parseCoordinate(text, axis);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(message);
  });
});

describe('formatDms', () => {
  it('writes degrees, minutes, seconds and the hemisphere', () => {
    expect(formatDms(-0.1275, 'lon')).toBe('0° 07′ 39.0″ W');
    expect(formatDms(51.477222, 'lat')).toBe('51° 28′ 38.0″ N');
    expect(formatDms(-33.867917, 'lat')).toBe('33° 52′ 04.5″ S');
  });

  // Edge cases: rounding must carry into the next minute, not print 60.0″.
  it('carries 59.96″ into the next minute', () => {
    expect(formatDms(10 + 59 / 60 + 59.96 / 3600, 'lat')).toBe('11° 00′ 00.0″ N');
  });

  it('round-trips through parseCoordinate to the stored precision', () => {
    for (const v of [0, 1.5, -45.123456, 89.999, -179.5, 120.000278]) {
      const axis = Math.abs(v) > 90 ? 'lon' : 'lat';
      const back = parseCoordinate(formatDms(v, axis), axis);
      expect(back.ok).toBe(true);
      // One decimal of a second is 1/36000° ≈ 2.8e-5°.
      if (back.ok) expect(Math.abs(back.value - v)).toBeLessThan(1.5e-5);
    }
  });

  it('reads plain decimal degrees (the quick path) exactly as the same value written with a hemisphere letter', () => {
    const cases: [string, string, 'lat' | 'lon'][] = [
      ['47.25', '47.25 N', 'lat'],
      ['-2.5', '2.5 W', 'lon'],
      [' +12.1234567 ', '12.1234567 N', 'lat'],
      ['.5', '.5 E', 'lon'],
      ['-0', '0 S', 'lat'],
      ['90', '90 N', 'lat'],
      ['90.0000001', '90.0000001 N', 'lat'],
      ['-180.5', '180.5 W', 'lon'],
    ];
    for (const [plain, lettered, axis] of cases) expect(parseCoordinate(plain, axis)).toEqual(parseCoordinate(lettered, axis));
    expect(parseCoordinate('-0', 'lat')).toEqual({ ok: true, value: 0 });
    expect(parseCoordinate('90.0000001', 'lat')).toEqual({ ok: false, error: 'Latitude must be between -90 and 90 degrees.' });
    expect(parseCoordinate('', 'lon')).toEqual({ ok: false, error: 'Longitude is required.' });
  });
});
