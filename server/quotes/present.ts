import type { QuoteOptionSnapshot, QuoteStudySnapshot } from './snapshot';
import { declinationWords, studyPointing } from '@/server/pointing/magnetic-declination';
import { diameterLabel, readQuotedOption, savingWords, type OptionReading } from '@/server/study-option';
import { endSentence } from './sentence';

/**
 * Turns a quote's snapshots into what the customer's page and the PDF print: one place for the
 * words, so both say the same. Pure.
 */

const COMPASS_16 = ['north', 'north-northeast', 'northeast', 'east-northeast', 'east', 'east-southeast', 'southeast', 'south-southeast', 'south', 'south-southwest', 'southwest', 'west-southwest', 'west', 'west-northwest', 'northwest', 'north-northwest'];

/** 16-point compass word for an azimuth (degrees clockwise from true north). */
function compassWord(azimuthDeg: number): string {
  const i = Math.round((((azimuthDeg % 360) + 360) % 360) / 22.5) % 16;
  return COMPASS_16[i];
}

/** Orbital position as people write it: "19.2° E". */
function orbitalPosition(longitudeDeg: number): string {
  const abs = Math.abs(longitudeDeg);
  return `${abs.toFixed(1)}° ${longitudeDeg < 0 ? 'W' : 'E'}`;
}

export interface PresentedOption {
  option: QuoteOptionSnapshot;
  reading: OptionReading;
  label: string;
  saving: string | null;
  quoted: boolean;
}

/** The options in the order shown, each with its reading; the smallest shown dish that works is the comparison baseline. */
export function presentOptions(options: QuoteOptionSnapshot[], chosenIndex: number): PresentedOption[] {
  const sorted = [...options].sort((a, b) => a.diameterM - b.diameterM || a.index - b.index);
  const baseline = sorted.find((o) => o.closes) ?? sorted[0];
  return sorted.map((o) => {
    const saved = baseline && o.closes && baseline.closes ? baseline.outage.outageMinutesPerYear - o.outage.outageMinutesPerYear : 0;
    // Only plain figures on both sides make a saving we can state; bounds would make it a guess.
    const comparable = o.outage.outageBound === 'none' && baseline?.outage.outageBound === 'none';
    return {
      option: o,
      reading: readQuotedOption(o),
      label: o.dishName,
      saving: o !== baseline && comparable ? savingWords(saved, diameterLabel(baseline.diameterM).cm) : null,
      quoted: o.index === chosenIndex,
    };
  });
}

/** Two or three sentences about the site and the service, without jargon. */
export function siteAndServiceInWords(s: QuoteStudySnapshot): { site: string; service: string; pointing: string } {
  const site = endSentence(`${s.site.name}, for ${s.site.customerName}`);
  const service = endSentence(`${s.service.name}, from the ${s.service.satelliteName} satellite at ${orbitalPosition(s.service.satelliteLongitudeDeg)}${s.service.transmits ? ', sending as well as receiving' : ''}`);
  const p = s.pointing;
  // The compass bearing for the day the study was computed (World Magnetic Model 2025), beside the true one.
  const m = studyPointing(s.site, p, new Date(s.computedAt));
  const pointing = `From this site the dish looks ${compassWord(p.azimuthDeg)} (${p.azimuthDeg.toFixed(1)}° from true north, ${m.magneticAzimuthDeg.toFixed(1)}° on a compass: magnetic declination ${declinationWords(m.declination.declinationDeg)}, WMM2025), ${p.elevationDeg.toFixed(1)}° above the horizon; the view in that direction must be clear of trees and buildings.`;
  return { site, service, pointing };
}
