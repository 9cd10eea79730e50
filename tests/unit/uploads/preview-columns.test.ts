import { describe, expect, it } from 'vitest';
import { previewColumnLabel } from '@/components/uploads/preview-columns';

describe('previewColumnLabel', () => {
  it('names the parsers’ fields in words with units', () => {
    expect(previewColumnLabel('rainfallMm')).toBe('Rainfall (mm)');
    expect(previewColumnLabel('rainRateMmH')).toBe('Rain rate (mm/h)');
    expect(previewColumnLabel('pPercent')).toBe('Exceeded (% of the year)');
  });
  it('splits an unknown camelCase key into words', () => {
    expect(previewColumnLabel('currentDishCm')).toBe('Current dish cm');
  });
});
