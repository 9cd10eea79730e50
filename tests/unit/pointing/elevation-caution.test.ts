import { describe, expect, it } from 'vitest';
import { lowElevationCaution } from '@/server/pointing/elevation-caution';

// The 5–10° band is common practice, no source; below 5° the engine's own warning speaks.
describe('lowElevationCaution', () => {
  it('speaks from 5° up to (not including) 10°', () => {
    expect(lowElevationCaution(4.99)).toBeNull();
    expect(lowElevationCaution(5)?.text).toMatch(/5\.0° above the horizon/);
    expect(lowElevationCaution(9.94)?.text).toMatch(/obstruct|trees/);
    expect(lowElevationCaution(10)).toBeNull();
    expect(lowElevationCaution(Number.NaN)).toBeNull();
  });
});
