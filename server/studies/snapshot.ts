import type { TradeoffResult, TradeoffScenario } from '@/server/engine/tradeoff-types';
import type { ClimateKind, ClimateData } from '@/db/models/climate-profile';
import type { AltitudeSource } from '@/db/models/site';
import type { Polarization, ServiceUplink } from '@/db/models/service-profile';
import type { MapsClimateData } from './maps-climate';

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
  /** Where the altitude came from (typed in, or the ITU-R P.1511-1 map); absent in studies made before it was recorded. */
  altitudeSource?: AltitudeSource;
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

/**
 * The rain climate a study used: a company profile (an override), or 'itu-r-maps' (the default:
 * read from the ITU-R maps at the site, data = MapsClimateData with the map versions).
 */
export interface ClimateSnapshot {
  id: number | null;
  name: string;
  kind: ClimateKind | 'itu-r-maps';
  data: ClimateData | MapsClimateData;
  zeroIsothermKm: number | null;
  sourceNote: string;
  /**
   * Where an override profile's figures were measured or made for; null = an unknown place.
   * Absent for the maps (they are read at the site) and in studies made before it was recorded.
   */
  location?: { latDeg: number; lonDeg: number } | null;
}

/**
 * What the ITU-R maps gave at the site for the parts of every new study that always come from
 * them, whatever the rain climate: gases, clouds and scintillation (P.836-6, P.840-8, P.1510-1,
 * P.453-14), and the P.839-4 0 °C isotherm for an override profile that gives none.
 */
export interface SiteMapsSnapshot {
  /** P.839-4 h0 at the site, km. */
  isothermHeightKm: number;
  /** True when the rain height used this map value (maps climate, or a profile without its own h0). */
  isothermUsed: boolean;
  /** P.1511-1 topographic height at the site, km (the default station altitude). */
  topographicHeightKm: number;
  /** P.453-14 median N_wet at the site. */
  nWetMedian: number;
  /** The Recommendations whose maps were read, then `maps:<hash>`. */
  mapVersions: string[];
  mapDataVersion: string;
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
  /** The ITU-R maps at the site (every study since the site's own climate; absent in older ones). */
  siteMaps?: SiteMapsSnapshot;
}

/**
 * A point of the attenuation-exceedance curve. Rain-only studies (older ones): P.618-14 §2.2.1.1
 * step 10. Since the site's own climate: `attenuationDb` is the P.618-14 §2.5 TOTAL and the four
 * components are stored beside it (absent in older snapshots, which then plot rain only).
 */
export interface ExceedancePoint {
  pPercent: number;
  attenuationDb: number;
  gasDb?: number;
  cloudDb?: number;
  rainDb?: number;
  scintillationDb?: number;
}

export interface StudyResultSnapshot {
  schemaVersion: 1;
  engineVersion: string;
  computedAt: string;
  tradeoff: TradeoffResult;
  /** Downlink attenuation exceeded for p % of an average year, 0.001–5 %, for the curve chart. */
  exceedanceCurve: ExceedancePoint[];
  /**
   * The option whose total curve `exceedanceCurve` is (scintillation depends on the dish): the
   * recommended dish, else the smallest. Absent for rain-only curves, which no dish changes.
   */
  exceedanceCurveOptionIndex?: number;
}
