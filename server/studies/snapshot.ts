import type { TradeoffResult, TradeoffScenario } from '@/server/engine/tradeoff-types';
import type { ClimateKind, ClimateData } from '@/db/models/climate-profile';
import type { Polarization, ServiceUplink } from '@/db/models/service-profile';

/**
 * What a study stores, so that it can always be shown (and quoted) exactly as it was computed,
 * whatever later happens to the catalogue, the profiles or the engine. Plain JSON: numbers as
 * numbers, money as decimal strings.
 */

export interface SiteSnapshot {
  id: number | null;
  name: string;
  customerId: number | null;
  customerName: string;
  latDeg: number;
  lonDeg: number;
  altitudeM: number;
}

export interface ServiceSnapshot {
  id: number | null;
  name: string;
  satelliteName: string;
  satelliteLongitudeDeg: number;
  downlinkFrequencyGHz: number;
  polarization: Polarization;
  polarizationTiltDeg: number;
  eirpDbw: number;
  symbolRateMsps: number;
  modcod: string | null;
  requiredEsN0Db: number;
  implementationMarginDb: number;
  otherLossesDb: number;
  lnbNoiseTempK: number;
  antennaNoiseTempK: number;
  uplink: ServiceUplink | null;
  acmModcods: string[] | null;
}

export interface ClimateSnapshot {
  id: number | null;
  name: string;
  kind: ClimateKind;
  data: ClimateData;
  zeroIsothermKm: number | null;
  sourceNote: string;
}

/** A catalogue row as it was when the study was made (prices are exact decimal strings). */
export interface DishSnapshot {
  dishId: number | null;
  name: string;
  diameterM: number;
  efficiency: number;
  hardwarePrice: string;
  labourPrice: string;
  mountNotes: string | null;
}

export interface StudyInputsSnapshot {
  /** Version of this snapshot layout, so a later reader can migrate old rows on the fly. */
  schemaVersion: 1;
  site: SiteSnapshot;
  service: ServiceSnapshot;
  climate: ClimateSnapshot;
  /** In the order of the trade-off options (ascending diameter). */
  dishes: DishSnapshot[];
  targetAvailabilityPercent: number;
  /** Polarization tilt τ handed to ITU-R P.838-3 for the downlink, from the skew at this site. */
  downlinkTiltDeg: number;
  /** Exactly what went into dishTradeoff. */
  scenario: TradeoffScenario;
}

/** A point of the attenuation-exceedance curve (ITU-R P.618-14 §2.2.1.1 step 10). */
export interface ExceedancePoint {
  pPercent: number;
  attenuationDb: number;
}

export interface StudyResultSnapshot {
  schemaVersion: 1;
  engineVersion: string;
  computedAt: string;
  tradeoff: TradeoffResult;
  /** Downlink rain attenuation exceeded for p % of an average year, 0.001–5 %, for the curve chart. */
  exceedanceCurve: ExceedancePoint[];
}
