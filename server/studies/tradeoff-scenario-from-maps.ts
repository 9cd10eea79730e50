import type { TradeoffScenario } from '@/server/engine/tradeoff-types';
import type { RainClimateInput } from '@/server/engine/rain-climate-source';
import type { TradeoffScenarioInput } from '@/server/validation/tradeoff-scenario';
import { siteMaps } from '@/server/climate-maps';
import { mapsRainInput } from './maps-climate';

/** One scenario field the request left out and the ITU-R maps at the site filled in. */
export interface MapFilledField {
  field: 'site.altitudeKm' | 'rain' | 'rain.zeroIsothermHeightKm' | 'atmosphere';
  /** The Recommendation the value was read with. */
  source: string;
  /** The value, for single figures (km); null for the rain climate and the atmosphere, whose figures are in the result. */
  value: number | null;
}

/** What the integrator is told about the maps: every filled field and the map data read. */
export interface MapInputs {
  filled: MapFilledField[];
  /** 'ITU-R P.837-7', … then 'maps:<hash>' (the map data version); empty when no map was read. */
  mapVersions: string[];
}

/** Gases, clouds and scintillation come from these maps (server/climate-maps/site-atmosphere.ts). */
const ATMOSPHERE_SOURCE = 'ITU-R P.836-6 water vapour, P.840-8 cloud liquid, P.1510-1 temperature, P.453-14 N_wet maps';

const hasRainHeight = (rain: NonNullable<TradeoffScenarioInput['rain']>) => rain.rainHeightKm !== undefined || rain.zeroIsothermHeightKm !== undefined;

/**
 * A validated API scenario → the engine scenario, every missing site figure read from the ITU-R
 * maps at the site's coordinates (server/engine/README.md §7; the API's rule is written on the schema):
 * altitude (P.1511-1, to 1 m as a study takes it), rain climate (P.837-7 Annex 1 from the maps),
 * rain height (P.839-4) when the given climate has none, and the atmosphere unless the request
 * sends `atmosphere: null`. The maps are read only when something is missing.
 *
 * A site without map data throws EngineInputError on `site.latDeg` (→ 422 naming it); the
 * engine then refuses a satellite below the horizon on `satellite.longitudeDeg`.
 *
 * @example
 * scenarioFromMaps({ site: { latDeg: 47.1, lonDeg: 2.6 }, … }).scenario.rain // => { monthlyRainfallMm: [...], origin: 'itu-r-maps', zeroIsothermHeightKm: 2.40… }
 */
export function scenarioFromMaps(input: TradeoffScenarioInput): { scenario: TradeoffScenario; mapInputs: MapInputs } {
  const { latDeg, lonDeg } = input.site;
  const { atmosphere: atmosphereChoice, rain: givenRain, ...rest } = input;
  const needsClimate = input.site.altitudeKm === undefined || givenRain === undefined || !hasRainHeight(givenRain);
  const wantsAtmosphere = atmosphereChoice !== null;
  const filled: MapFilledField[] = [];
  const mapVersions = new Set<string>();

  // The climate maps are read with the atmosphere too: their versions are part of what the answer names.
  const maps = needsClimate || wantsAtmosphere ? siteMaps({ latDeg, lonDeg, stationHeightKm: input.site.altitudeKm, atmosphere: wantsAtmosphere }) : null;
  const data = maps?.climate ?? null;
  if (data) for (const v of data.mapVersions) mapVersions.add(v);

  let altitudeKm = input.site.altitudeKm;
  if (altitudeKm === undefined) {
    // Rounded to 1 m like a site's stored altitude, so the API and a study of the same site agree.
    altitudeKm = maps!.stationHeightKm;
    filled.push({ field: 'site.altitudeKm', source: 'ITU-R P.1511-1 topographic height', value: altitudeKm });
  }

  let rain: RainClimateInput;
  if (givenRain === undefined) {
    rain = mapsRainInput(data!);
    filled.push({ field: 'rain', source: 'ITU-R P.837-7 Annex 1 from the P.837-7 monthly rainfall and P.1510-1 monthly temperature maps', value: null });
    filled.push({ field: 'rain.zeroIsothermHeightKm', source: 'ITU-R P.839-4', value: data!.isothermHeightKm });
  } else if (!hasRainHeight(givenRain)) {
    rain = { ...givenRain, zeroIsothermHeightKm: data!.isothermHeightKm } as RainClimateInput;
    filled.push({ field: 'rain.zeroIsothermHeightKm', source: 'ITU-R P.839-4', value: data!.isothermHeightKm });
  } else {
    rain = givenRain as RainClimateInput;
  }

  const scenario: TradeoffScenario = { ...(rest as Omit<TradeoffScenario, 'rain' | 'site'>), site: { latDeg, lonDeg, altitudeKm }, rain };
  if (wantsAtmosphere) {
    scenario.atmosphere = maps!.atmosphere!;
    filled.push({ field: 'atmosphere', source: ATMOSPHERE_SOURCE, value: null });
    for (const r of ['ITU-R P.836-6', 'ITU-R P.840-8']) mapVersions.add(r);
  }
  return { scenario, mapInputs: { filled, mapVersions: sortVersions([...mapVersions]) } };
}

/** Recommendations in order, the `maps:<hash>` data version last. */
function sortVersions(v: string[]): string[] {
  return v.sort((a, b) => Number(a.startsWith('maps:')) - Number(b.startsWith('maps:')) || a.localeCompare(b));
}
