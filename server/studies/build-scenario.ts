import { geoLookAngles } from '@/server/engine';
import type { TradeoffScenario } from '@/server/engine/tradeoff-types';
import type { RainClimateInput } from '@/server/engine/rain-climate-source';
import type { ClimateZone } from '@/server/engine/p837-1-climate-zones';
import type { SiteAtmosphere } from '@/server/engine/site-atmosphere';
import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot, SiteSnapshot } from './snapshot';

/** ITU-R P.838-3: τ = 45° for circular polarization. */
const CIRCULAR_TILT_DEG = 45;

/**
 * Polarization tilt τ of ITU-R P.838-3 (angle of the E-field to the local horizontal) for a linear
 * carrier: the satellite's H or V plane turned by the skew at this site (engine geoLookAngles),
 * plus any tilt the operator states for the carrier. P.838 only uses cos 2τ, so τ is folded into 0–90°.
 *
 * @example downlinkTiltDeg('linear-horizontal', 0, 12) // => 12
 */
export function downlinkTiltDeg(polarization: ServiceSnapshot['polarization'], offsetDeg: number, skewDeg: number): number {
  if (polarization === 'circular') return CIRCULAR_TILT_DEG;
  const base = polarization === 'linear-vertical' ? 90 : 0;
  const t = (((base + skewDeg + offsetDeg) % 180) + 180) % 180;
  return Math.round((t > 90 ? 180 - t : t) * 1e6) / 1e6;
}

/**
 * The study's rain climate as the engine's rain input (server/engine/README.md §1), with its rain height: the
 * profile's own 0 °C isotherm, else the P.839-4 map value at the site (`fallbackIsothermKm`),
 * else (old snapshots only) the engine's latitude approximation.
 */
export function rainInputOf(climate: ClimateSnapshot, fallbackIsothermKm: number | null = null): RainClimateInput {
  const isotherm = climate.zeroIsothermKm ?? fallbackIsothermKm;
  const height = isotherm === null ? {} : { zeroIsothermHeightKm: isotherm };
  const data = climate.data as Record<string, unknown>;
  switch (climate.kind) {
    case 'itu-r-maps':
      return { monthlyRainfallMm: data.monthlyRainfallMm as number[], monthlyTemperatureC: data.monthlyTemperatureC as number[], origin: 'itu-r-maps', ...height };
    case 'known-r001':
      return { r001MmH: data.r001MmH as number, ...height };
    case 'monthly-normals':
      return { monthlyRainfallMm: data.monthlyRainfallMm as number[], monthlyTemperatureC: data.monthlyTemperatureC as number[], ...height };
    case 'measured-curve':
      return { measuredCurve: data.points as { pPercent: number; rainRateMmH: number }[], ...height };
    case 'climate-zone':
      return { climateZone: data.zone as ClimateZone, ...height };
  }
}

/**
 * Site + service + climate + the chosen dishes → the engine scenario of dishTradeoff.
 * Dishes go in ascending diameter so the table reads small to large and the baseline is the smallest.
 */
export function buildScenario(
  o: {
    site: SiteSnapshot;
    service: ServiceSnapshot;
    dishes: DishSnapshot[];
    targetAvailabilityPercent: number;
    /** The site's atmosphere from the ITU-R maps: outages on the P.618 §2.5 total. Null only for old snapshots. */
    atmosphere?: SiteAtmosphere | null;
  } & (
    | {
        climate: ClimateSnapshot;
        /** The P.839-4 map isotherm at the site, for override profiles that give none. */
        fallbackIsothermKm?: number | null;
      }
    /** The engine's rain input, already made (a campaign row: mapsRainInput, or rainInputOf its override). */
    | { rain: RainClimateInput }
  ),
): { scenario: TradeoffScenario; downlinkTiltDeg: number; dishes: DishSnapshot[] } {
  const site = { latDeg: o.site.latDeg, lonDeg: o.site.lonDeg, altitudeKm: o.site.altitudeM / 1000 };
  const look = geoLookAngles({ ...site, satelliteLongitudeDeg: o.service.satelliteLongitudeDeg });
  const tilt = downlinkTiltDeg(o.service.polarization, o.service.polarizationTiltDeg, look.polarizationSkewDeg);
  const dishes = [...o.dishes].sort((a, b) => a.diameterM - b.diameterM || a.name.localeCompare(b.name));
  const s = o.service;
  const scenario: TradeoffScenario = {
    site,
    satellite: { longitudeDeg: s.satelliteLongitudeDeg },
    downlink: {
      frequencyGHz: s.downlinkFrequencyGHz,
      tiltDeg: tilt,
      eirpDbw: s.eirpDbw,
      symbolRateMsps: s.symbolRateMsps,
      requiredEsN0Db: s.requiredEsN0Db,
      implementationMarginDb: s.implementationMarginDb,
      otherLossesDb: s.otherLossesDb,
    },
    receiver: { lnbNoiseTempK: s.lnbNoiseTempK, antennaNoiseTempK: s.antennaNoiseTempK },
    rain: 'rain' in o ? o.rain : rainInputOf(o.climate, o.fallbackIsothermKm ?? null),
    dishes: dishes.map((d) => ({ diameterM: d.diameterM, efficiency: d.efficiency, priceUsd: d.hardwarePrice, labourUsd: d.labourPrice })),
    targetAvailabilityPercent: o.targetAvailabilityPercent,
  };
  if (s.uplink) {
    scenario.uplink = {
      frequencyGHz: s.uplink.frequencyGHz,
      // Return carriers of two-way terminals use the orthogonal linear polarization of the
      // forward carrier (common practice, no source); circular stays at 45°.
      tiltDeg: s.polarization === 'circular' ? CIRCULAR_TILT_DEG : 90 - tilt,
      ...(s.uplink.hpaPowerW !== undefined ? { hpaPowerW: s.uplink.hpaPowerW } : { terminalEirpDbw: s.uplink.terminalEirpDbw }),
      satelliteGOverTDbK: s.uplink.satelliteGOverTDbK,
      symbolRateMsps: s.uplink.symbolRateMsps,
      requiredEsN0Db: s.uplink.requiredEsN0Db,
      implementationMarginDb: s.uplink.implementationMarginDb,
    };
  }
  if (s.acmModcods && s.acmModcods.length) scenario.acm = { modcods: s.acmModcods };
  if (o.atmosphere) scenario.atmosphere = o.atmosphere;
  return { scenario, downlinkTiltDeg: tilt, dishes };
}
