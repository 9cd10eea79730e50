import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { availabilityText, availabilityWords } from './availability';
import { basisFiguresOf, meetsTarget, type BasisFigures } from './basis';
import { diameterLabel, type DiameterLabel } from './diameter';
import { durationShort, outageDurationWords, outageMinutesText, roundedDuration } from './durations';
import { OUTAGE_MARK, outageRounding, outageQualifier, type OutageQualifier } from './qualifier';
import { outagePercentText } from './outage-share';
import { outageYearWords, worstMonthWords } from './outage-words';

/**
 * What one computed option means and how it reads, decided here once for the study table, the
 * charts, the quote, the PDF, the customer's page, the e-mails and the campaign rows.
 */
export interface OptionReading {
  diameterM: number;
  figures: BasisFigures;
  closes: boolean;
  /** Known to meet the target availability (unknown or no target: false). */
  meetsTarget: boolean;
  qualifier: OutageQualifier;
  /** The outage figures are upper bounds: below the model range, or a two-way sum. */
  outageIsUpperBound: boolean;
  /** The outage figures are lower bounds: above the model range. */
  outageIsLowerBound: boolean;
  diameter: DiameterLabel;
  availability: {
    /** "99.951 %", "> 99.999 %"; "—" when the dish never works. */
    text: string;
    /** "99.951 % of an average year". */
    words: string;
  };
  outage: {
    /** "0.049 %" of the year, signed by its bound; "—" when the dish never works. */
    percentText: string;
    /** "258 min", "< 5.3 min", "≤ 258 min". */
    minutesText: string;
    /** The same figure in the unit that reads best: "4.3 h", "45 min", "18 d". */
    durationText: string;
    /** "about 4.3 hours", "less than 5.3 minutes". */
    phrase: string;
    /** "About 4.3 hours a year without signal, mostly in the heaviest storms." */
    yearWords: string;
  };
  worstMonth: {
    minutesText: string;
    /** "In the worst month of a typical year: about 71 minutes."; null when the dish never works. */
    words: string | null;
  };
}

const NEVER = '—';

/**
 * Reads an option from its basis figures.
 *
 * Bad input: negative, NaN or infinite minutes or percentages throw RangeError (the figures come
 * from the engine, so this means a damaged snapshot).
 *
 * @example readOption({ diameterM: 0.9, figures, knownToMeetTarget: true }).availability.text // => '99.951 %'
 */
function readOption(o: { diameterM: number; figures: BasisFigures; knownToMeetTarget: boolean | null | undefined }): OptionReading {
  const f = o.figures;
  const q = outageQualifier(f);
  const closes = f.closes;
  return {
    diameterM: o.diameterM,
    figures: f,
    closes,
    meetsTarget: meetsTarget(closes, o.knownToMeetTarget),
    qualifier: q,
    outageIsUpperBound: q === 'less-than' || q === 'at-most-about',
    outageIsLowerBound: q === 'more-than',
    diameter: diameterLabel(o.diameterM),
    availability: { text: availabilityText(f), words: availabilityWords(f) },
    outage: {
      percentText: closes ? outagePercentText(f.outagePercent, q) : NEVER,
      minutesText: closes ? outageMinutesText(f.outageMinutesPerYear, q) : NEVER,
      durationText: closes ? `${OUTAGE_MARK[q]}${durationShort(roundedDuration(f.outageMinutesPerYear, outageRounding(q)))}` : NEVER,
      phrase: closes ? outageDurationWords(f.outageMinutesPerYear, q) : 'all the time',
      yearWords: outageYearWords(f),
    },
    worstMonth: {
      minutesText: closes ? outageMinutesText(f.worstMonthOutageMinutes, q) : NEVER,
      words: worstMonthWords(f),
    },
  };
}

/** Option `index` of a stored study result, on the study's basis. */
export function readStudyOption(tradeoff: Pick<TradeoffResult, 'options' | 'recommendation'>, index: number): OptionReading {
  const option = tradeoff.options[index];
  if (!option) throw new RangeError(`the study has no option ${index}`);
  return readOption({ diameterM: option.diameterM, figures: basisFiguresOf(option, tradeoff.recommendation.basis), knownToMeetTarget: option.meetsTarget });
}

/** Every option of a stored study result, in the study's order. */
export function readStudyOptions(tradeoff: Pick<TradeoffResult, 'options' | 'recommendation'>): OptionReading[] {
  return tradeoff.options.map((_, i) => readStudyOption(tradeoff, i));
}

/** An option as a quote keeps it (figures copied from the study on its basis when the quote was made). */
export function readQuotedOption(o: { diameterM: number; closes: boolean; meetsTarget: boolean | null; outage: Omit<BasisFigures, 'closes'> }): OptionReading {
  return readOption({ diameterM: o.diameterM, figures: { closes: o.closes, ...o.outage }, knownToMeetTarget: o.meetsTarget });
}
