import type { BasisFigures } from '@/server/study-option';
import type { ClimateSnapshot } from '@/server/studies/snapshot';

// The lifecycle lives in ./status; the demo seeder still reads the type from here.
export type { QuoteStatus } from './status';

/**
 * What a quote keeps of its study, frozen at creation: the customer is shown exactly these
 * figures for as long as the quote lives, whatever happens to the study, the catalogue or the
 * engine later. Plain JSON: numbers as numbers, money as decimal strings.
 */

/**
 * Outage of one option on the study's basis (downlink alone, or two-way for VSAT terminals), as
 * the study's read model gave it when the quote was made; `closes` is kept beside it on the option.
 */
export type QuoteOutage = Omit<BasisFigures, 'closes'>;

/** One option as the customer sees it. */
export interface QuoteOptionSnapshot {
  /** Index of the option in the study's trade-off (input order, ascending diameter). */
  index: number;
  dishName: string;
  diameterM: number;
  gainDbi: number;
  gOverTDbK: number;
  /** Clear-sky margin, dB; ≤ 0 means the dish does not receive the service at all. */
  marginDb: number;
  closes: boolean;
  fadeThresholdDb: number | null;
  outage: QuoteOutage;
  meetsTarget: boolean | null;
  minutesSavedPerYear: number;
  /** Catalogue prices of the study (exact decimal strings), before extras, discount and tax. */
  hardwarePrice: string;
  labourPrice: string;
  cataloguePrice: string;
  mountNotes: string | null;
  /** The engine's pick: smallest dish meeting the target availability. */
  smallestMeetingTarget: boolean;
  /** The engine's pick: lowest price per minute saved. */
  bestValue: boolean;
}

export interface QuoteStudySnapshot {
  schemaVersion: 1;
  studyId: number;
  studyTitle: string;
  studyRevision: number;
  engineVersion: string;
  computedAt: string;
  site: { name: string; customerName: string; latDeg: number; lonDeg: number; altitudeM: number };
  service: {
    name: string;
    satelliteName: string;
    satelliteLongitudeDeg: number;
    downlinkFrequencyGHz: number;
    polarization: string;
    modcod: string | null;
    /** A terminal that also transmits (VSAT return link): RF exposure caution applies. */
    transmits: boolean;
  };
  climate: {
    name: string;
    sourceNote: string;
    /**
     * Where the rain climate came from: 'itu-r-maps' (read at the site's coordinates) or a company
     * profile's kind. Absent on quotes made before the maps existed: all of those used a profile.
     */
    kind?: ClimateSnapshot['kind'];
  };
  /**
   * 'total': the outages count gases, clouds, rain and scintillation (ITU-R P.618-14 §2.5);
   * 'rain': rain only. Absent on quotes of engine-1.0 studies, which were all rain only.
   */
  attenuationModel?: 'total' | 'rain';
  pointing: { azimuthDeg: number; elevationDeg: number; polarizationSkewDeg: number };
  targetAvailabilityPercent: number | null;
  basis: 'downlink' | 'two-way';
  /** Engine warnings as written for people. */
  warnings: { code: string; message: string; optionIndex?: number }[];
}
