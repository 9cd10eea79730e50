import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { dishTradeoff } from '@/server/engine';
import { basisFiguresOf, closesOnBasis, readQuotedOption, readStudyOption, readStudyOptions } from '@/server/study-option';
import { quoteOptionsOf } from '@/server/quotes/options-of-study';
import { demoScenario } from '../engine/tradeoff-fixture';

const uplink = { frequencyGHz: 14.25, tiltDeg: 90, terminalEirpDbw: 48, satelliteGOverTDbK: 3, symbolRateMsps: 2, requiredEsN0Db: 4.03, implementationMarginDb: 1 };

describe('reading a stored study option', () => {
  it('downlink study: the option is judged on its downlink figures, and reads them with the one rule', () => {
    const t = dishTradeoff(demoScenario());
    const r = readStudyOption(t, 3);
    const o = t.options[3];
    expect(r.figures.outageMinutesPerYear).toBe(o.outageMinutesPerYear);
    expect(r.figures.isUpperBound).toBe(false);
    expect(r.closes).toBe(o.closes);
    expect(r.meetsTarget).toBe(o.meetsTarget === true);
    // The same hours in the table's second line and in the customer's sentence.
    const hours = r.outage.durationText.replace(/^[<>≤] /, '').split(' ')[0];
    expect(r.outage.yearWords).toContain(`${hours} `);
    expect(Number(r.availability.text.replace(/[^\d.]/g, ''))).toBeLessThanOrEqual(o.availabilityPercent);
  });

  it('two-way study: the two-way sum is the basis, read as an upper bound ("at most about", "≥")', () => {
    const t = dishTradeoff(demoScenario({ uplink }));
    expect(t.recommendation.basis).toBe('two-way');
    const i = t.options.findIndex((o) => o.twoWay && o.twoWay.outageBound === 'none' && o.uplink?.closes);
    expect(i).toBeGreaterThanOrEqual(0);
    const r = readStudyOption(t, i);
    expect(r.figures.outageMinutesPerYear).toBe(t.options[i].twoWay!.outageMinutesPerYear);
    expect(r.outageIsUpperBound).toBe(true);
    expect(r.availability.text.startsWith('≥ ')).toBe(true);
    expect(r.outage.yearWords.startsWith('At most about ')).toBe(true);
  });

  it('meets the target only when that is known: a missing target or an unjudged option never reads as meeting it', () => {
    const t = dishTradeoff(demoScenario({ targetAvailabilityPercent: undefined }));
    expect(readStudyOptions(t).every((r) => r.meetsTarget === false)).toBe(true);
    const withTarget = dishTradeoff(demoScenario());
    const readings = readStudyOptions(withTarget);
    expect(readings.some((r) => r.meetsTarget)).toBe(true);
    readings.forEach((r, i) => expect(r.meetsTarget).toBe(withTarget.options[i].meetsTarget === true && r.closes));
  });

  it('a quote reads its copied option exactly as the study reads the option it came from', () => {
    for (const scenario of [demoScenario(), demoScenario({ uplink })]) {
      const t = dishTradeoff(scenario);
      const quoted = quoteOptionsOf({ id: 1, title: 'x', revision: 1, inputs: { dishes: [] } as never, result: { tradeoff: t } as never });
      quoted.forEach((q, i) => {
        const fromQuote = readQuotedOption(q);
        const fromStudy = readStudyOption(t, i);
        expect(fromQuote.availability).toEqual(fromStudy.availability);
        expect(fromQuote.outage).toEqual(fromStudy.outage);
        expect(fromQuote.worstMonth).toEqual(fromStudy.worstMonth);
        expect(fromQuote.meetsTarget).toBe(fromStudy.meetsTarget);
      });
    }
  });

  describe('edge cases', () => {
    it('a two-way study whose option lost its uplink figures does not close (unknown is not "works")', () => {
      const t = dishTradeoff(demoScenario({ uplink }));
      const o = { ...t.options[5], uplink: null };
      expect(closesOnBasis(o, 'two-way')).toBe(false);
      expect(basisFiguresOf(o, 'two-way').closes).toBe(false);
      expect(closesOnBasis(o, 'downlink')).toBe(true);
    });
    it('a dish that does not close reads "—" in cells and says so in words', () => {
      const t = dishTradeoff(demoScenario({ downlink: { ...demoScenario().downlink, eirpDbw: 38 } }));
      const i = t.options.findIndex((o) => !o.closes);
      expect(i).toBeGreaterThanOrEqual(0);
      const r = readStudyOption(t, i);
      expect(r.availability.text).toBe('—');
      expect(r.outage.minutesText).toBe('—');
      expect(r.meetsTarget).toBe(false);
      expect(r.worstMonth.words).toBeNull();
    });
    it('an index outside the study is refused', () => {
      expect(() => readStudyOption(dishTradeoff(demoScenario()), 99)).toThrow(RangeError);
    });
  });
});

describe('the read model stays browser-safe', () => {
  it('imports nothing but its own files and the engine’s types and constants', () => {
    const dir = path.resolve(__dirname, '../../../server/study-option');
    for (const file of readdirSync(dir)) {
      const text = readFileSync(path.join(dir, file), 'utf8');
      for (const [, spec] of text.matchAll(/from '([^']+)'/g)) {
        expect(spec, `${file} imports ${spec}`).toMatch(/^(\.\/|@\/server\/engine\/)/);
      }
      expect(text, file).not.toMatch(/import 'server-only'|'use server'/);
    }
  });
});
