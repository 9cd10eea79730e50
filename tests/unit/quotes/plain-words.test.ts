import { describe, expect, it } from 'vitest';
import { availabilityInWords, describeOutage, diameterInWords, durationInWords, savingInWords } from '@/server/quotes/plain-words';
import { outageFigures } from '@/server/engine/outage-figures';
import { MINUTES_PER_YEAR } from '@/server/engine/physical-constants';

// Figures built with the engine's own outageFigures (server/engine/README.md §4: minutes = p/100 × 525 960,
// worst month by ITU-R P.841), so the words are tested on the shapes the customer page receives.
const figures = (pPercent: number, bound: 'none' | 'below-model-range' | 'above-model-range' = 'none') => ({ closes: true, ...outageFigures(pPercent, bound) });

describe('durationInWords', () => {
  it('rounds "about" figures to a friendly step for their size', () => {
    expect(durationInWords(0.4, 'about')).toBe('less than a minute');
    expect(durationInWords(1.2, 'about')).toBe('about 1 minute');
    expect(durationInWords(7.6, 'about')).toBe('about 8 minutes');
    expect(durationInWords(43, 'about')).toBe('about 45 minutes');
    expect(durationInWords(58, 'about')).toBe('about 1 hour');
    expect(durationInWords(95, 'about')).toBe('about 1.5 hours');
    expect(durationInWords(360, 'about')).toBe('about 6 hours');
    expect(durationInWords(14 * 60 + 20, 'about')).toBe('about 14 hours');
    expect(durationInWords(3 * 1440 + 100, 'about')).toBe('about 3 days');
  });

  it('rounds upper bounds up, so "less than" stays true', () => {
    // 0.001 % of a year = 5.2596 min: "less than 5 minutes" would be false, so 6.
    expect(durationInWords((0.001 / 100) * MINUTES_PER_YEAR, 'less-than')).toBe('less than 6 minutes');
    expect(durationInWords(0.5, 'less-than')).toBe('less than a minute');
    expect(durationInWords(61, 'less-than')).toBe('less than 2 hours');
    expect(durationInWords(60, 'less-than')).toBe('less than 60 minutes');
  });

  it('rounds lower bounds down, so "more than" stays true', () => {
    // 5 % of a year = 26 298 min = 18.26 days.
    expect(durationInWords((5 / 100) * MINUTES_PER_YEAR, 'more-than')).toBe('more than 18 days');
    expect(durationInWords(119, 'more-than')).toBe('more than 1 hour');
  });

  it('says "at most about" for figures that are themselves upper bounds (two-way sums)', () => {
    expect(durationInWords(360, 'at-most-about')).toBe('at most about 6 hours');
    expect(durationInWords(0.2, 'at-most-about')).toBe('less than a minute');
  });

  describe('edge cases', () => {
    it('refuses negative, NaN and infinite durations', () => {
      expect(() => durationInWords(-1, 'about')).toThrow(RangeError);
      expect(() => durationInWords(Number.NaN, 'about')).toThrow(RangeError);
      expect(() => durationInWords(Number.POSITIVE_INFINITY, 'less-than')).toThrow(RangeError);
    });
    it('handles zero', () => {
      expect(durationInWords(0, 'about')).toBe('less than a minute');
      expect(durationInWords(0, 'more-than')).toBe('more than 0 minutes');
    });
    it('switches units at the step edges without odd figures like "60 minutes" or "48 hours"', () => {
      expect(durationInWords(57.4, 'about')).toBe('about 55 minutes');
      expect(durationInWords(2849, 'about')).toBe('about 47 hours');
      expect(durationInWords(2851, 'about')).toBe('about 2 days');
    });
  });
});

describe('describeOutage', () => {
  it('reads the brief example: about 6 hours a year, mostly in the heaviest storms', () => {
    // 360 min a year = 0.06845 % of the year.
    const words = describeOutage(figures((360 / MINUTES_PER_YEAR) * 100));
    expect(words.year).toBe('About 6 hours a year without signal, mostly in the heaviest storms.');
    expect(words.availability).toBe('99.931 % of an average year');
    expect(words.worstMonth).toMatch(/^In the worst month of a typical year: about /);
  });

  it('is honest about the lower end of the model range', () => {
    const words = describeOutage(figures(0.001, 'below-model-range'));
    expect(words.year).toBe('Less than 6 minutes a year without signal, only in the heaviest storms.');
    expect(words.availability).toBe('more than 99.999 % of an average year');
    expect(words.worstMonth).toMatch(/^In the worst month of a typical year: less than /);
  });

  it('is honest about the upper end of the model range', () => {
    const words = describeOutage(figures(5, 'above-model-range'));
    expect(words.year).toBe('More than 18 days a year without signal, during heavy and even moderate rain.');
    expect(words.availability).toBe('less than 95.000 % of an average year');
  });

  it('names the kind of rain by how rare the outage is', () => {
    expect(describeOutage(figures(0.005)).year).toContain('only in the heaviest storms');
    expect(describeOutage(figures(0.05)).year).toContain('mostly in the heaviest storms');
    expect(describeOutage(figures(0.5)).year).toContain('mostly during heavy rain');
    expect(describeOutage(figures(2)).year).toContain('heavy and even moderate rain');
  });

  it('says "at most" and "at least" for two-way upper bounds', () => {
    const words = describeOutage({ ...figures(0.05), isUpperBound: true });
    expect(words.year).toMatch(/^At most about 4.5 hours a year/);
    expect(words.availability).toBe('at least 99.950 % of an average year');
  });

  it('says plainly when a dish cannot receive the service', () => {
    const words = describeOutage({ ...figures(100), closes: false });
    expect(words.year).toMatch(/No usable signal at all/);
    expect(words.worstMonth).toBeNull();
  });

  describe('edge cases', () => {
    it('never rounds availability up past the figure', () => {
      // 99.99949 would round to 99.999 and 100.000 at three decimals; we floor.
      expect(availabilityInWords({ closes: true, availabilityPercent: 99.99949, outageBound: 'none' })).toBe('99.999 % of an average year');
      expect(availabilityInWords({ closes: true, availabilityPercent: 100 - 0.001, outageBound: 'below-model-range' })).toBe('more than 99.999 % of an average year');
    });
  });
});

describe('savingInWords and diameterInWords', () => {
  it('states what a bigger dish buys back', () => {
    expect(savingInWords(300, '60 cm')).toBe('About 5 hours a year more signal than the 60 cm dish.');
    expect(savingInWords(0.3, '60 cm')).toBeNull();
    expect(savingInWords(Number.NaN, '60 cm')).toBeNull();
  });
  it('gives centimetres with inches beside (2.54 cm per inch)', () => {
    expect(diameterInWords(0.75)).toBe('75 cm (30 in)');
    expect(diameterInWords(1.2)).toBe('120 cm (47 in)');
  });
});
