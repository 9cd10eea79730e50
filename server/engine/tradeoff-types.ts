import type { AcmThroughput } from './acm-throughput';
import type { Modcod } from './dvb-s2-modcods';
import type { OutageFigures } from './outage-figures';
import type { ExceedanceBound } from './p618-rain-path';
import type { RainHeightSource } from './p839-rain-height';
import type { ClimateSource, RainClimateInput } from './rain-climate-source';
import type { AttenuationComponents } from './p618-total-attenuation';
import type { SiteAtmosphere } from './site-atmosphere';

/**
 * Input and result types of the dish trade-off (server/engine/README.md §4–§5). Conventions for bounds and
 * "does not close" are on {@link OutageFigures} and {@link TradeoffOption}.
 *
 * @example
 * const row: TradeoffOption = dishTradeoff(scenario).options[0];
 * row.closes ? `${row.outageMinutesPerYear.toFixed(0)} min/year` : 'does not close' // => '259 min/year'
 */

/** Money input: a decimal string ("1249.90") or a number; kept exact with decimal.js. */
export type MoneyInput = string | number;

/** One candidate dish. */
export interface TradeoffDishInput {
  /** Reflector diameter, m (> 0). */
  diameterM: number;
  /** Aperture efficiency η, 0 < η ≤ 1. */
  efficiency: number;
  /** Hardware price, USD. */
  priceUsd?: MoneyInput;
  /** Installation labour, USD. */
  labourUsd?: MoneyInput;
  /** Uplink HPA (BUC) power for this dish's kit, W; overrides `uplink.hpaPowerW`. */
  hpaPowerW?: number;
}

/** The downlink carrier. */
export interface TradeoffDownlinkInput {
  frequencyGHz: number;
  /** Polarization tilt τ, degrees (0 horizontal, 90 vertical, 45 circular; ITU-R P.838-3). */
  tiltDeg: number;
  /** Satellite EIRP toward the site, dBW. */
  eirpDbw: number;
  symbolRateMsps: number;
  /** Es/N0 of the service MODCOD, dB (e.g. DVB-S2 ideal AWGN threshold). */
  requiredEsN0Db: number;
  implementationMarginDb: number;
  /** Other clear-sky losses (gases, radome…), dB; default 0. */
  otherLossesDb?: number;
  /** Residual pointing error of the installed dish, degrees; default 0 (see pointingLoss). */
  pointingErrorDeg?: number;
}

/** Receiving system at the site, K. */
export interface TradeoffReceiverInput {
  lnbNoiseTempK: number;
  antennaNoiseTempK: number;
  /** Mean radiating temperature of rain; 275 K if omitted (common practice). */
  mediumTempK?: number;
}

/** Return link from the site (two-way terminals). Give exactly one of `terminalEirpDbw` / `hpaPowerW`. */
export interface TradeoffUplinkInput {
  frequencyGHz: number;
  tiltDeg: number;
  /** Fixed terminal EIRP, dBW, the same for every dish. */
  terminalEirpDbw?: number;
  /** HPA power at the feed, W: EIRP = 10 log10 P + dish gain at the uplink frequency − feedLossDb − pointing loss. */
  hpaPowerW?: number;
  /** Loss between HPA and feed, dB; default 0. */
  feedLossDb?: number;
  /** Satellite receive G/T toward the site, dB/K. */
  satelliteGOverTDbK: number;
  symbolRateMsps: number;
  requiredEsN0Db: number;
  implementationMarginDb?: number;
  otherLossesDb?: number;
}

/** A MODCOD of the ACM set: a DVB-S2 name from DVB_S2_MODCODS, or a custom entry. */
export type AcmModcodInput = string | Modcod;

/** The scenario of {@link dishTradeoff}. Degrees; east-positive longitudes. */
export interface TradeoffScenario {
  site: { latDeg: number; lonDeg: number; altitudeKm: number };
  satellite: { longitudeDeg: number };
  downlink: TradeoffDownlinkInput;
  receiver: TradeoffReceiverInput;
  rain: RainClimateInput;
  dishes: readonly TradeoffDishInput[];
  /** Target availability, % (e.g. 99.9); enables `smallestMeetingTargetIndex`. */
  targetAvailabilityPercent?: number;
  uplink?: TradeoffUplinkInput;
  /** ACM carrier: expected throughput per dish over this MODCOD set. */
  acm?: { modcods: readonly AcmModcodInput[] };
  /** Optional scintillation layer (ITU-R P.618-14 §2.4.1): wet refractivity N_wet at the site (ITU-R P.453). */
  scintillation?: { nWet: number };
  /**
   * The site's atmosphere from the ITU-R maps (server/climate-maps): with it the outage of every
   * dish is where the P.618-14 §2.5 TOTAL (gases, clouds, rain, scintillation) reaches the fade
   * threshold, and each component is reported beside it (server/engine/README.md §7).
   */
  atmosphere?: SiteAtmosphere;
}

/** Uplink of one dish. */
export interface UplinkOption extends OutageFigures {
  gainDbi: number;
  eirpDbw: number;
  clearSkyEsN0Db: number;
  /** Clear-sky margin, dB; ≤ 0 → closes = false (a shortfall, shown as such, never as a fade threshold). */
  marginDb: number;
  closes: boolean;
  /** Uplink rain attenuation that uses up the margin, dB (= margin: no noise increase at the satellite); null when it does not close. */
  fadeThresholdDb: number | null;
  /** With an atmosphere: each attenuation component at the uplink outage p; null otherwise. */
  attenuationAtOutage: AttenuationComponents | null;
}

/** Two-way outage: p_up + p_down (server/engine/README.md §4), an UPPER bound on the true two-way outage. */
export interface TwoWayOutage extends OutageFigures {
  isUpperBound: true;
}

/** Downlink with the scintillation layer (P.618-14 §2.5 without gases and clouds). */
export interface ScintillationLayer extends OutageFigures {
  /** σ of the scintillation for this dish, dB (§2.4.1 step 7). */
  sigmaDb: number;
}

/** One row of the trade-off, one per input dish, in input order. */
export interface TradeoffOption extends OutageFigures {
  index: number;
  diameterM: number;
  efficiency: number;
  /** Downlink boresight gain, dBi. */
  gainDbi: number;
  beamwidthDeg: number;
  pointingLossDb: number;
  /** Clear-sky system noise temperature T_rx + T_ant, K. */
  systemNoiseTempK: number;
  gOverTDbK: number;
  cOverN0DbHz: number;
  clearSkyEsN0Db: number;
  /** Clear-sky margin over required Es/N0 + implementation margin, dB. Negative = shortfall (does not close). */
  marginDb: number;
  /** False when the margin is ≤ 0: the dish never works with this carrier (outage 100 %). */
  closes: boolean;
  /** A*, dB: rain attenuation at which the margin is used up, with the noise increase of rain; null when it does not close. */
  fadeThresholdDb: number | null;
  /**
   * With an atmosphere (result.attenuationModel 'total'): gas, cloud, rain and scintillation at
   * this dish's outage p, and their P.618-14 §2.5 total (= the fade threshold unless bounded);
   * null for rain-only studies and dishes that do not close.
   */
  attenuationAtOutage: AttenuationComponents | null;
  uplink: UplinkOption | null;
  twoWay: TwoWayOutage | null;
  acm: AcmThroughput | null;
  scintillation: ScintillationLayer | null;
  /** Hardware + labour, USD, 2 decimals; null when neither was given. */
  priceUsd: string | null;
  /** Outage minutes per year of the smallest dish minus this dish's (on the recommendation basis). */
  minutesSavedPerYear: number;
  /** (price − smallest dish's price) / minutes saved per year, USD per (minute per year), 4 decimals; null without prices, for the smallest dish, or when nothing is saved. */
  costPerMinuteSavedUsd: string | null;
  /** Whether the availability (on the basis) is known to meet the target; null without a target. */
  meetsTarget: boolean | null;
}

/** What to buy. Indexes point into `options` (input order). */
export interface TradeoffRecommendation {
  /** 'two-way' when an uplink is given, else 'downlink': the outage used for economics and the target. */
  basis: 'downlink' | 'two-way';
  targetAvailabilityPercent: number | null;
  /** The smallest dish (by diameter) against which minutes and costs are counted. */
  baselineIndex: number;
  /** Smallest dish meeting the target; null without a target or when none meets it. */
  smallestMeetingTargetIndex: number | null;
  /** Lowest cost per minute saved; null without prices or when no dish saves minutes. */
  bestValueIndex: number | null;
  /** Smallest dish reaching 90 % of the largest possible saving (engine convention, no source). */
  diminishingReturnsIndex: number;
}

export type EngineWarningCode =
  | 'low-elevation'
  | 'rain-height-approximation'
  | 'no-rain-fade'
  | 'dish-does-not-close'
  | 'uplink-does-not-close'
  | 'outage-below-model-range'
  | 'outage-above-model-range'
  | 'two-way-upper-bound'
  | 'target-not-met'
  | 'target-beyond-model-range'
  | 'scintillation-skipped'
  | 'atmosphere-skipped'
  | 'scintillation-frequency-extrapolated'
  | 'acm-model-range'
  | 'pointing-error-large';

/** Something the user should read next to the numbers. */
export interface EngineWarning {
  code: EngineWarningCode;
  message: string;
  /** The option it concerns, when it concerns one dish. */
  optionIndex?: number;
}

/** The result of {@link dishTradeoff}. */
export interface TradeoffResult {
  engineVersion: string;
  elevationDeg: number;
  azimuthDeg: number;
  rangeKm: number;
  polarizationSkewDeg: number;
  rainHeightKm: number;
  rainHeightSource: RainHeightSource;
  climateSource: ClimateSource;
  /** Downlink free-space loss, dB. */
  freeSpaceLossDb: number;
  /** 'total': outages are on the P.618-14 §2.5 total (gases, clouds, rain, scintillation); 'rain': rain only. */
  attenuationModel: 'total' | 'rain';
  /** The downlink's atmosphere as used ('total' only): station pressure (P.835), temperature (P.1510-1), N_wet (P.453-14), gases and clouds at 1 %. */
  atmosphere: { pressureHpa: number; surfaceTemperatureK: number; nWetMedian: number; gas1PctDb: number; cloud1PctDb: number } | null;
  /** Downlink A_0.01 (ITU-R P.618-14 step 9), dB. */
  rainAttenuation001Db: number;
  options: TradeoffOption[];
  recommendation: TradeoffRecommendation;
  warnings: EngineWarning[];
}

export type { ExceedanceBound };
