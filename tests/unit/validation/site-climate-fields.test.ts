import { describe, expect, it } from 'vitest';
import { newStudySchema, MAPS_CLIMATE_VALUE } from '@/server/validation/study';
import { siteSchema } from '@/server/validation/site';
import { climateFormSchema, climateProfileSchema } from '@/server/validation/climate';
import { uploadConfirmSchema } from '@/server/validation/upload';

/**
 * Issue 9 form rules: the study's climate defaults to the ITU-R maps ('' or 'maps' → null), a blank
 * altitude is "not given" (the server fills it from P.1511-1), and a profile's place is optional but
 * needs both coordinates.
 */
const study = (over: Record<string, unknown> = {}) => ({
  customerMode: 'new', newCustomerName: 'Wickham Hollow Inn', siteMode: 'new', siteName: 'Inn gable',
  latDeg: '48.6', lonDeg: '21 50 W', serviceProfileId: '3', dishIds: '1,2', ...over,
});

describe('newStudySchema: climate and altitude', () => {
  it.each([[undefined], [''], [MAPS_CLIMATE_VALUE], [null]])('climateProfileId %s means the ITU-R maps (null)', (v) => {
    const r = newStudySchema.parse(study({ climateProfileId: v }));
    expect(r.climateProfileId).toBeNull();
  });

  it('a profile id is an override', () => {
    expect(newStudySchema.parse(study({ climateProfileId: '12' })).climateProfileId).toBe(12);
  });

  it('a blank altitude is left for the map; a typed one is kept', () => {
    expect(newStudySchema.parse(study({ altitudeM: '' })).site).toMatchObject({ latDeg: 48.6, lonDeg: -21.833333, altitudeM: undefined });
    expect(newStudySchema.parse(study({ altitudeM: '212' })).site).toMatchObject({ altitudeM: 212 });
    expect(newStudySchema.parse(study({ altitudeM: '0' })).site).toMatchObject({ altitudeM: 0 });
  });

  // Edge cases: a word for a profile, an altitude out of range.
  it('refuses a climate that is neither the maps nor an id, and an altitude out of range', () => {
    const r = newStudySchema.safeParse(study({ climateProfileId: 'nearby', altitudeM: '7000' }));
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['climateProfileId', 'altitudeM']));
  });
});

describe('siteSchema: altitude', () => {
  it('blank is undefined (filled from ITU-R P.1511-1 on the server), a number is kept', () => {
    const base = { customerId: '1', name: 'Dock shed', latDeg: '47.9', lonDeg: '-20.7' };
    expect(siteSchema.parse({ ...base, altitudeM: '  ' }).altitudeM).toBeUndefined();
    expect(siteSchema.parse(base).altitudeM).toBeUndefined();
    expect(siteSchema.parse({ ...base, altitudeM: '-12.5' }).altitudeM).toBe(-12.5);
    expect(siteSchema.safeParse({ ...base, altitudeM: 'high' }).success).toBe(false);
  });
});

describe('climate profile place', () => {
  const form = { name: 'Harbour gauge', kind: 'known-r001', r001MmH: '31', sourceNote: 'invented' };

  it('is optional, and parsed like a site (decimal or DMS)', () => {
    expect(climateFormSchema.parse(form)).toMatchObject({ latDeg: undefined, lonDeg: undefined });
    expect(climateFormSchema.parse({ ...form, latDeg: `47°54'N`, lonDeg: '20.74 W' })).toMatchObject({ latDeg: 47.9, lonDeg: -20.74 });
  });

  it('needs both coordinates or neither, naming the missing box', () => {
    const r = climateFormSchema.safeParse({ ...form, latDeg: '47.9' });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['lonDeg', 'Give the longitude too, or leave both blank.']]);
    const api = climateProfileSchema.safeParse({ kind: 'known-r001', name: 'x', sourceNote: 'y', data: { r001MmH: 20 }, lonDeg: 3 });
    expect(api.error!.issues.map((i) => i.path.join('.'))).toEqual(['latDeg']);
  });

  // Edge case: a bad coordinate says what is wrong, as on the site form.
  it('refuses a bad coordinate with the site form’s words', () => {
    const r = climateFormSchema.safeParse({ ...form, latDeg: '12 75 0 N', lonDeg: '3' });
    expect(r.error!.issues[0]).toMatchObject({ path: ['latDeg'], message: 'Minutes must be below 60.' });
  });

  it('uploads of normals and curves take the same place', () => {
    const file = new File(['p_percent,rain_rate_mm_h\n1,2\n'], 'c.csv');
    const ok = uploadConfirmSchema.parse({ kind: 'rain-curve', file, name: 'Gauge', sourceNote: 'invented', latDeg: '49.1', lonDeg: '-22.4' });
    expect(ok).toMatchObject({ latDeg: 49.1, lonDeg: -22.4 });
    expect(uploadConfirmSchema.safeParse({ kind: 'rain-curve', file, name: 'Gauge', sourceNote: 'invented', lonDeg: '-22.4' }).success).toBe(false);
  });
});
