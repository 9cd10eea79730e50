import { describe, expect, it } from 'vitest';
import {
  availabilityNumber,
  availabilityText,
  availabilityWords,
  diameterLabel,
  dishName,
  minutesCell,
  minutesText,
  outageDurationWords,
  outageMinutesText,
  outagePercentText,
  outageYearWords,
  roundedDuration,
  roundToPlaces,
  savedMinutesCell,
  savedMinutesNumber,
  savingWords,
  worstMonthWords,
  type BasisFigures,
} from '@/server/study-option';
import { outageFigures } from '@/server/engine/outage-figures';
import { MINUTES_PER_YEAR } from '@/server/engine/physical-constants';

// Figures built with the engine's own outageFigures (server/engine/README.md §4: minutes = p/100 × 525 960,
// worst month by ITU-R P.841), so the words are tested on the shapes the screens receive.
const figures = (pPercent: number, bound: 'none' | 'below-model-range' | 'above-model-range' = 'none', isUpperBound = false): BasisFigures => ({ closes: true, isUpperBound, ...outageFigures(pPercent, bound) });

describe('the one rounding rule', () => {
  it('rounds a good thing down and a bad thing up at the digits shown', () => {
    expect(roundToPlaces(99.99949, 3, 'down')).toBe(99.999);
    expect(roundToPlaces(5.2596, 1, 'up')).toBe(5.3);
    expect(roundToPlaces(5.2596, 1, 'down')).toBe(5.2);
  });
  it('reads stored binary fractions as the decimals they stand for', () => {
    // 1.005 × 1000 is 1004.9999999999999 in binary floating point: it must still read 1.005.
    expect(1.005 * 1000).toBeLessThan(1005);
    expect(roundToPlaces(1.005, 3, 'down')).toBe(1.005);
    expect(roundToPlaces(0.1 + 0.2, 1, 'up')).toBe(0.3);
  });
  it('durations: one decimal below 10, whole from 10, in the unit that reads best after rounding', () => {
    expect(roundedDuration(257.2, 'up')).toEqual({ value: 4.3, places: 1, unit: 'hour' });
    expect(roundedDuration(43.2, 'up')).toEqual({ value: 44, places: 0, unit: 'minute' });
    expect(roundedDuration(9.96, 'up')).toEqual({ value: 10, places: 0, unit: 'minute' });
    expect(roundedDuration(59.96, 'up')).toEqual({ value: 1, places: 1, unit: 'hour' });
    // 47.5 h rounds up to 48 h, which reads as 2 days, never "48 hours".
    expect(roundedDuration(2849, 'up')).toEqual({ value: 2, places: 1, unit: 'day' });
    expect(roundedDuration(2849, 'down')).toEqual({ value: 47, places: 0, unit: 'hour' });
  });

  describe('edge cases', () => {
    it('refuses figures that are not numbers, and negative durations', () => {
      expect(() => roundToPlaces(Number.NaN, 1, 'up')).toThrow(RangeError);
      expect(() => roundToPlaces(1, 11, 'up')).toThrow(RangeError);
      expect(() => roundedDuration(-1, 'up')).toThrow(RangeError);
      expect(() => minutesText(Number.POSITIVE_INFINITY, 'up')).toThrow(RangeError);
      expect(() => savedMinutesNumber(Number.NaN)).toThrow(RangeError);
    });
    it('zero stays zero in either direction', () => {
      expect(minutesText(0, 'up')).toBe('0 min');
      expect(roundedDuration(0, 'down')).toEqual({ value: 0, places: 1, unit: 'minute' });
    });
  });
});

describe('availability', () => {
  it('never reaches 100 % or a target the figure does not', () => {
    expect(availabilityNumber(figures(0.00051))).toBe('99.999');
    // 99.94999 against a target of 99.95: shown below the target, as the engine judges it.
    expect(availabilityText({ closes: true, availabilityPercent: 99.94999, outageBound: 'none', isUpperBound: false })).toBe('99.949 %');
  });
  it('agrees with the target at every figure: the shown number is ≥ the target exactly when the figure is', () => {
    const targets = [99, 99.5, 99.9, 99.95, 99.99, 99.995, 99.999];
    const disagreements: string[] = [];
    for (let k = 0; k < 5000; k++) {
      // Spread over 99–100 %, with figures a hair either side of each target.
      const availability = k < 4000 ? 99 + ((k * 7919) % 100000) / 100000 : targets[k % targets.length] + ((k % 2) * 2 - 1) * 1e-9;
      const shown = Number(availabilityNumber({ closes: true, availabilityPercent: availability, outageBound: 'none', isUpperBound: false }));
      for (const target of targets) if (shown >= target !== availability >= target) disagreements.push(`${availability} vs ${target}`);
    }
    expect(disagreements).toEqual([]);
  });
  it('says which way a bounded figure goes, in a cell and in words', () => {
    expect(availabilityText(figures(0.001, 'below-model-range'))).toBe('> 99.999 %');
    expect(availabilityWords(figures(0.001, 'below-model-range'))).toBe('more than 99.999 % of an average year');
    expect(availabilityText(figures(5, 'above-model-range'))).toBe('< 95.000 %');
    expect(availabilityWords(figures(5, 'above-model-range'))).toBe('less than 95.000 % of an average year');
    // A two-way sum is an upper bound on the outage, so the availability is a lower bound.
    expect(availabilityText(figures(0.05, 'none', true))).toBe('≥ 99.950 %');
    expect(availabilityWords(figures(0.05, 'none', true))).toBe('at least 99.950 % of an average year');
  });

  describe('edge cases', () => {
    it('an upper bound on availability rounds up, so "less than" stays true', () => {
      expect(availabilityText({ closes: true, availabilityPercent: 94.99961, outageBound: 'above-model-range', isUpperBound: false })).toBe('< 95.000 %');
    });
    it('a dish that never works has no availability', () => {
      expect(availabilityText({ ...figures(100), closes: false })).toBe('—');
      expect(availabilityWords({ ...figures(100), closes: false })).toBe('none: the service cannot be received with this dish');
    });
  });
});

describe('outage in minutes, hours and words', () => {
  it('the table and the words carry the same figure', () => {
    const f = figures(0.0489); // 257.2 min a year
    expect(outageMinutesText(f.outageMinutesPerYear, 'about')).toBe('258 min');
    expect(outageYearWords(f)).toBe('About 4.3 hours a year without signal, mostly in the heaviest storms.');
    expect(worstMonthWords(f)).toMatch(/^In the worst month of a typical year: about \d/);
  });
  it('is honest about the lower end of the model range', () => {
    const f = figures(0.001, 'below-model-range'); // 5.2596 min: "less than 5.2" would be false
    expect(outageMinutesText(f.outageMinutesPerYear, 'less-than')).toBe('< 5.3 min');
    expect(outageYearWords(f)).toBe('Less than 5.3 minutes a year without signal, only in the heaviest storms.');
    expect(worstMonthWords(f)).toMatch(/^In the worst month of a typical year: less than /);
  });
  it('is honest about the upper end of the model range', () => {
    // 5 % of a year = 26 298 min = 18.26 days: "more than 18.3 days" would be false.
    const f = figures(5, 'above-model-range');
    expect(outageMinutesText(f.outageMinutesPerYear, 'more-than')).toBe('> 26,298 min');
    expect(outageYearWords(f)).toBe('More than 18 days a year without signal, during heavy and even moderate rain.');
  });
  it('says "at most about" for two-way sums', () => {
    const f = figures(0.05, 'none', true); // 262.98 min
    expect(outageMinutesText(f.outageMinutesPerYear, 'at-most-about')).toBe('≤ 263 min');
    expect(outageYearWords(f)).toMatch(/^At most about 4.4 hours a year/);
  });
  it('names the kind of rain by how rare the outage is', () => {
    expect(outageYearWords(figures(0.005))).toContain('only in the heaviest storms');
    expect(outageYearWords(figures(0.05))).toContain('mostly in the heaviest storms');
    expect(outageYearWords(figures(0.5))).toContain('mostly during heavy rain');
    expect(outageYearWords(figures(2))).toContain('heavy and even moderate rain');
  });
  it('the share of the year keeps two significant digits when small', () => {
    expect(outagePercentText(0.02134, 'about')).toBe('0.022 %');
    expect(outagePercentText(0.001, 'less-than')).toBe('< 0.0010 %');
    expect(outagePercentText(5, 'more-than')).toBe('> 5.00 %');
  });
  it('a file cell has no grouping and no sign', () => {
    expect(minutesCell(26297.6, 'up')).toBe('26298');
    expect(minutesCell(5.2596, 'up')).toBe('5.3');
  });

  describe('edge cases', () => {
    it('a dish that cannot receive the service says so, with no worst month', () => {
      const f = { ...figures(100), closes: false };
      expect(outageYearWords(f)).toMatch(/No usable signal at all/);
      expect(worstMonthWords(f)).toBeNull();
    });
    it('one minute and one hour are singular', () => {
      expect(outageDurationWords(0.96, 'about')).toBe('about 1 minute');
      expect(outageDurationWords(59.97, 'about')).toBe('about 1 hour');
    });
    it('no outage at all is said plainly', () => {
      expect(outageYearWords(figures(0))).toBe('No time without signal predicted in an average year.');
    });
  });
});

describe('savings', () => {
  it('round down: never more than the figures support', () => {
    expect(savedMinutesNumber(512.93)).toBe('512');
    expect(savedMinutesCell(512.93)).toBe('512');
    expect(savingWords(300, '60 cm')).toBe('About 5 hours a year more signal than the 60 cm dish.');
    expect(savingWords(509, '60 cm')).toBe('About 8.4 hours a year more signal than the 60 cm dish.');
  });
  describe('edge cases', () => {
    it('a loss shows as a negative, rounded up; less than a minute is no saving', () => {
      expect(savedMinutesNumber(-3.21)).toBe('−3.3');
      expect(savedMinutesCell(-3.21)).toBe('-3.3');
      expect(savingWords(0.3, '60 cm')).toBeNull();
      expect(savingWords(Number.NaN, '60 cm')).toBeNull();
    });
  });
});

describe('diameter', () => {
  it('centimetres with inches beside (2.54 cm per inch), one rule for every screen', () => {
    expect(diameterLabel(0.75)).toEqual({ cm: '75 cm', inches: '29.5 in', words: '75 cm (29.5 in)' });
    expect(diameterLabel(1.2).words).toBe('120 cm (47.2 in)');
    expect(diameterLabel(0.455).cm).toBe('45.5 cm');
  });
  it('a dish without a catalogue name is named by its size', () => {
    expect(dishName(null, 0.9)).toBe('90 cm dish');
    expect(dishName('Dish 90 Pro', 0.9)).toBe('Dish 90 Pro');
  });
});

// Sanity of the fixture itself: the words above rest on the engine's own minutes.
it('0.001 % of a year is 5.2596 minutes (server/engine/README.md §4)', () => {
  expect((0.001 / 100) * MINUTES_PER_YEAR).toBeCloseTo(5.2596, 4);
});
