import { monthlyRainClimate } from '../engine/p837-7-monthly-climate';
import { bicubicP1144At } from './bicubic-p1144';
import { bilinearCell, bilinearInCell } from './bilinear';
import { loadGrid, requireSameGeometry, type Grid } from './grid';
import { MAP_DATA_VERSION, mapFileFor } from './map-catalogue';
import { checkCoordinates, mapValueOrRefuse, type SiteCoordinates } from './site-input';

/** Rain height above the 0 °C isotherm, km (Rec. ITU-R P.839-4 §2). */
export const RAIN_HEIGHT_ABOVE_ISOTHERM_KM = 0.36;
/** 0 °C in kelvin: the P.1510-1 maps are in K, P.837-7 Annex 1 wants °C. */
const ZERO_CELSIUS_K = 273.15;
/** P.1511-1 reads its map with longitude in [0, 360) (see the maps README). */
const P1511_LON_START_DEG = 0;
/** The percentage of the year whose rain rate a study starts from. */
const P_R001_PERCENT = 0.01;

/** Which Recommendation each figure of a {@link SiteClimate} comes from. */
export const SITE_CLIMATE_SOURCES = Object.freeze({
  isothermHeightKm: 'ITU-R P.839-4',
  rainHeightKm: 'ITU-R P.839-4',
  topographicHeightKm: 'ITU-R P.1511-1',
  nWetMedian: 'ITU-R P.453-14',
  annualMeanTemperatureK: 'ITU-R P.1510-1',
  monthlyRainfallMm: 'ITU-R P.837-7',
  monthlyTemperatureC: 'ITU-R P.1510-1',
  r001MmH: 'ITU-R P.837-7 Annex 1',
  p0Percent: 'ITU-R P.837-7 Annex 1',
} as const);

/** A site's climate read from the ITU-R digital maps. */
export interface SiteClimate {
  latDeg: number;
  lonDeg: number;
  /** Mean annual 0 °C isotherm height h0, km above mean sea level. */
  isothermHeightKm: number;
  /** Rain height hR = h0 + 0.36 km. */
  rainHeightKm: number;
  /** Topographic height, km above mean sea level: the default station altitude. */
  topographicHeightKm: number;
  /** Wet term of surface refractivity exceeded 50 % of the year, N-units. */
  nWetMedian: number;
  annualMeanTemperatureK: number;
  /** Percentage of an average year with rain, %. */
  p0Percent: number;
  /** Rain rate exceeded 0.01 % of an average year, mm/h (0 where it rains less than that). */
  r001MmH: number;
  /** Monthly mean total rainfall MT, mm, January…December. */
  monthlyRainfallMm: number[];
  /** Monthly mean surface temperature, °C, January…December. */
  monthlyTemperatureC: number[];
  sources: typeof SITE_CLIMATE_SOURCES;
  /** The Recommendations whose maps were read, then `maps:<hash of maps.json>`. */
  mapVersions: string[];
}

interface ClimateGrids {
  /** The Recommendations of the maps below, then `maps:<hash>`: what a stored study records. */
  mapVersions: readonly string[];
  isotherm: Grid;
  topography: Grid;
  nWet: Grid;
  annualTemperature: Grid;
  monthlyRainfall: Grid[];
  monthlyTemperature: Grid[];
}

const MONTHS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12];
let climateGrids: ClimateGrids | null = null;

function grids(): ClimateGrids {
  if (climateGrids) return climateGrids;
  const monthlyRainfall = MONTHS.map((month) => loadGrid(mapFileFor('p837-7-monthly-rainfall-', { month })));
  const monthlyTemperature = MONTHS.map((month) => loadGrid(mapFileFor('p1510-1-surface-temperature-m', { month })));
  // The monthly maps are read through one cell per Recommendation, so each set must share a geometry.
  requireSameGeometry(monthlyRainfall);
  requireSameGeometry(monthlyTemperature);
  const isotherm = loadGrid('p839-4-isotherm-height.f32.gz');
  const topography = loadGrid('p1511-1-topographic-height.f32.gz');
  const nWet = loadGrid('p453-14-nwet-median.f32.gz');
  const annualTemperature = loadGrid('p1510-1-surface-temperature-annual.f32.gz');
  const read = [isotherm, topography, nWet, annualTemperature, ...monthlyRainfall, ...monthlyTemperature];
  const mapVersions = Object.freeze([...new Set(read.map((g) => g.entry.recommendation)), `maps:${MAP_DATA_VERSION}`]);
  return (climateGrids = { mapVersions, isotherm, topography, nWet, annualTemperature, monthlyRainfall, monthlyTemperature });
}

/** A site's climate as the maps give it, before P.837-7 Annex 1 turns the monthly normals into P0 and R0.01. */
export type SiteClimateMaps = Omit<SiteClimate, 'p0Percent' | 'r001MmH'>;

/**
 * A site's climate from its coordinates alone, read from the ITU-R digital maps: h0 and hR
 * (P.839-4, bilinear), topographic height (P.1511-1, P.1144 bicubic), median N_wet (P.453-14),
 * annual mean temperature (P.1510-1), and the 12 monthly MT (P.837-7) and T (P.1510-1) each
 * bilinear, taken through P.837-7 Annex 1 (the engine's `monthlyRainClimate`) to P0 and R0.01.
 * The maps load on the first call and stay in memory.
 *
 * A site where a map is blank, or coordinates that are not on the globe, throw
 * EngineInputError (field `site.latDeg` or `site.lonDeg`).
 *
 * @example
 * const c = siteClimate({ latDeg: 51.5, lonDeg: -0.14 })
 * c.rainHeightKm // => 2.4527… (ITU-R SG 3 validation example: 2.45273333)
 * c.p0Percent    // => 5.3615… (5.36150960)
 */
export function siteClimate(site: SiteCoordinates): SiteClimate {
  return withRainRate(siteClimateMaps(site));
}

/**
 * The map readings of {@link siteClimate} without its P.837-7 Annex 1 step, for callers that hand
 * the monthly normals to the engine, which works out R0.01 itself (a campaign row, the API).
 */
export function siteClimateMaps(site: SiteCoordinates): SiteClimateMaps {
  checkCoordinates(site);
  const { latDeg, lonDeg } = site;
  const g = grids();

  const isothermHeightKm = mapValueOrRefuse(bilinearInCell(g.isotherm.values, bilinearCell(g.isotherm.entry, latDeg, lonDeg)), g.isotherm.entry, site);
  const topographicHeightKm = mapValueOrRefuse(bicubicP1144At(g.topography, latDeg, lonDeg, P1511_LON_START_DEG), g.topography.entry, site);
  const nWetMedian = mapValueOrRefuse(bilinearInCell(g.nWet.values, bilinearCell(g.nWet.entry, latDeg, lonDeg)), g.nWet.entry, site);
  const annualMeanTemperatureK = mapValueOrRefuse(
    bilinearInCell(g.annualTemperature.values, bilinearCell(g.annualTemperature.entry, latDeg, lonDeg)),
    g.annualTemperature.entry,
    site,
  );

  const rainCell = bilinearCell(g.monthlyRainfall[0].entry, latDeg, lonDeg);
  const temperatureCell = bilinearCell(g.monthlyTemperature[0].entry, latDeg, lonDeg);
  const monthlyRainfallMm = new Array<number>(12);
  const monthlyTemperatureC = new Array<number>(12);
  for (let m = 0; m < 12; m++) {
    monthlyRainfallMm[m] = mapValueOrRefuse(bilinearInCell(g.monthlyRainfall[m].values, rainCell), g.monthlyRainfall[m].entry, site);
    monthlyTemperatureC[m] = mapValueOrRefuse(bilinearInCell(g.monthlyTemperature[m].values, temperatureCell), g.monthlyTemperature[m].entry, site) - ZERO_CELSIUS_K;
  }

  return {
    latDeg,
    lonDeg,
    isothermHeightKm,
    rainHeightKm: isothermHeightKm + RAIN_HEIGHT_ABOVE_ISOTHERM_KM,
    topographicHeightKm,
    nWetMedian,
    annualMeanTemperatureK,
    monthlyRainfallMm,
    monthlyTemperatureC,
    sources: SITE_CLIMATE_SOURCES,
    mapVersions: [...g.mapVersions],
  };
}

/**
 * P0 and R0.01 of the maps' monthly normals (P.837-7 Annex 1, the engine's `monthlyRainClimate`),
 * added to the map readings: what a study keeps in its snapshot.
 *
 * @example withRainRate(siteClimateMaps({ latDeg: 51.5, lonDeg: -0.14 })).r001MmH // => 26.48… mm/h
 */
export function withRainRate(c: SiteClimateMaps): SiteClimate {
  const rain = monthlyRainClimate({ monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC });
  // Same order of fields as before the split: snapshots are stored as JSON.
  return {
    latDeg: c.latDeg,
    lonDeg: c.lonDeg,
    isothermHeightKm: c.isothermHeightKm,
    rainHeightKm: c.rainHeightKm,
    topographicHeightKm: c.topographicHeightKm,
    nWetMedian: c.nWetMedian,
    annualMeanTemperatureK: c.annualMeanTemperatureK,
    p0Percent: rain.p0Percent,
    r001MmH: rain.rainRateExceeded(P_R001_PERCENT),
    monthlyRainfallMm: c.monthlyRainfallMm,
    monthlyTemperatureC: c.monthlyTemperatureC,
    sources: c.sources,
    mapVersions: c.mapVersions,
  };
}
