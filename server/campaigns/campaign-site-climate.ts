import { siteMaps } from '@/server/climate-maps';
import type { RainClimateInput } from '@/server/engine/rain-climate-source';
import type { SiteAtmosphere } from '@/server/engine/site-atmosphere';
import type { TradeoffResult } from '@/server/engine/tradeoff-types';
import { rainInputOf } from '@/server/studies/build-scenario';
import { mapsRainInput } from '@/server/studies/maps-climate';
import type { ClimateSnapshot } from '@/server/studies/snapshot';
import type { CampaignSiteRow } from './campaign-csv';

/** Where a campaign row's altitude came from: the uploaded file, or the maps at its coordinates. */
export type CampaignAltitudeSource = 'file' | 'ITU-R P.1511-1';

/** The climate one campaign row was computed with, each figure with its source (the result CSV's columns). */
export interface CampaignSiteClimate {
  /** R0.01 handed to P.618, mm/h. */
  r001MmH: number;
  /** "ITU-R maps at the site (P.837-7 Annex 1)" or the override profile's name. */
  rainClimateSource: string;
  /** Mean rain height h_R, km (P.839-4). */
  rainHeightKm: number;
  rainHeightSource: string;
  altitudeM: number;
  altitudeSource: CampaignAltitudeSource;
}

/** What the result says of the default source; the study screens use MAPS_CLIMATE_NAME for the same thing. */
export const CAMPAIGN_MAPS_RAIN_SOURCE = 'ITU-R maps at the site (P.837-7 Annex 1)';
const MAPS_RAIN_HEIGHT_SOURCE = 'ITU-R maps at the site (P.839-4)';

/**
 * One campaign row's own climate from the ITU-R maps at its coordinates (siteMaps): the rain
 * climate (unless a company profile overrides the rain climate of the whole campaign), the P.839-4
 * isotherm when that profile has none, the altitude when the file gives none (P.1511-1, to 1 m as
 * a site stores it), and the atmosphere at that altitude (gases, clouds, scintillation). The rain
 * climate goes to the engine as the maps' monthly normals: R0.01 is worked out there, once.
 *
 * A site the maps have no data for throws EngineInputError on `site.latDeg`: the caller makes it
 * a problem on the row's line.
 */
export function campaignSiteClimate(
  row: Pick<CampaignSiteRow, 'latDeg' | 'lonDeg' | 'altitudeM'>,
  override: ClimateSnapshot | null,
): {
  altitudeM: number;
  /** The engine's rain input, with its rain height. */
  rain: RainClimateInput;
  atmosphere: SiteAtmosphere;
  describe: (result: Pick<TradeoffResult, 'climateSource' | 'rainHeightKm' | 'rainHeightSource'>) => CampaignSiteClimate;
} {
  const maps = siteMaps({ latDeg: row.latDeg, lonDeg: row.lonDeg, stationHeightKm: row.altitudeM === null ? null : row.altitudeM / 1000 });
  const altitudeSource: CampaignAltitudeSource = maps.stationHeightFromMap ? 'ITU-R P.1511-1' : 'file';
  const altitudeM = row.altitudeM ?? maps.mapAltitudeM;
  return {
    altitudeM,
    rain: override ? rainInputOf(override, maps.climate.isothermHeightKm) : mapsRainInput(maps.climate),
    atmosphere: maps.atmosphere!,
    describe: (result) => ({
      r001MmH: result.climateSource.r001MmH,
      rainClimateSource: override ? `climate profile "${override.name}" (override)` : CAMPAIGN_MAPS_RAIN_SOURCE,
      rainHeightKm: result.rainHeightKm,
      // The profile's own isotherm comes first, else the map's (rainInputOf).
      rainHeightSource: override && override.zeroIsothermKm !== null ? `climate profile "${override.name}"` : MAPS_RAIN_HEIGHT_SOURCE,
      altitudeM,
      altitudeSource,
    }),
  };
}
