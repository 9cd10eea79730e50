import {
  availabilityNumber,
  availabilityText,
  minutesCell,
  outageMinutesNumber,
  outageQualifier,
  outageRounding,
  savedMinutesCell,
  savedMinutesNumber,
  type OutageQualifier,
} from '@/server/study-option';
import type { ExceedanceBound } from '@/server/engine/p618-rain-path';
import type { CampaignResultRow } from './campaign-compute';

/** How sure an outage of the file is, in the words of its bound column. */
const QUALIFIER_WORDS: Record<OutageQualifier, string> = { about: '', 'at-most-about': 'at most (two-way sum)', 'less-than': 'at most', 'more-than': 'at least' };

export interface CampaignOutageReading {
  /** For the page, sign included: "< 5.3", "258". */
  minutesNumber: string;
  /** For the file, no sign or grouping: "5.3", "258" (the bound column says which way). */
  minutesCell: string;
  boundWords: string;
}

function outageReading(minutes: number, bound: ExceedanceBound, twoWay: boolean): CampaignOutageReading {
  const q = outageQualifier({ outageBound: bound, isUpperBound: twoWay });
  return { minutesNumber: outageMinutesNumber(minutes, q), minutesCell: minutesCell(minutes, outageRounding(q)), boundWords: QUALIFIER_WORDS[q] };
}

/**
 * A campaign row as the page and the result file read it, with the study's own rounding rule
 * (server/study-option): outages up, availability and savings down, bounds kept.
 */
export function readCampaignRow(r: CampaignResultRow) {
  const figures = { closes: r.currentCloses, availabilityPercent: r.currentAvailabilityPercent, outageBound: r.currentOutageBound, isUpperBound: r.outageIsTwoWaySum };
  return {
    current: {
      ...outageReading(r.currentOutageMinutesPerYear, r.currentOutageBound, r.outageIsTwoWaySum),
      availabilityText: availabilityText(figures),
      availabilityCell: r.currentCloses ? availabilityNumber(figures) : '',
    },
    recommended: r.recommendedOutageMinutesPerYear === null || r.recommendedOutageBound === null ? null : outageReading(r.recommendedOutageMinutesPerYear, r.recommendedOutageBound, r.outageIsTwoWaySum),
    saved: r.minutesSavedPerYear === null ? null : { number: savedMinutesNumber(r.minutesSavedPerYear), cell: savedMinutesCell(r.minutesSavedPerYear) },
  };
}
