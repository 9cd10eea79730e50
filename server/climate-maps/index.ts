/**
 * FadeLedger's reader of the ITU-R digital maps (server/climate-maps/data): a site's climate and
 * atmosphere from its coordinates alone. Reads files, so it lives outside the pure engine; no
 * Next.js or `server-only` import, so scripts and workers can use it too.
 *
 * @example
 * import { siteClimate, siteAtmosphere } from '@/server/climate-maps';
 * siteClimate({ latDeg: 51.5, lonDeg: -0.14 }).r001MmH // => 26.48… mm/h
 */
export { siteClimate, siteClimateMaps, withRainRate, SITE_CLIMATE_SOURCES, RAIN_HEIGHT_ABOVE_ISOTHERM_KM } from './site-climate';
export { siteMaps } from './site-maps';
export { siteAtmosphere } from './site-atmosphere';
export { totalAttenuation } from './total-attenuation';
export { vapourAt } from './p836-6-water-vapour';
export { reducedCloudLiquidAt } from './p840-8-cloud-liquid';
export { TABULATED_P_PERCENT } from './log-p-interpolation';
export { MAP_DATA_VERSION, mapCatalogue, mapRecommendations } from './map-catalogue';
export { mapsDir } from './maps-dir';
export { gridLoadCount } from './grid';
export { preloadMaps } from './preload-maps';
export { MAX_STATION_HEIGHT_KM, MIN_STATION_HEIGHT_KM } from './site-input';

export type { SiteClimate, SiteClimateMaps } from './site-climate';
export type { SiteMaps, SiteMapsOptions } from './site-maps';
export type { TotalAttenuationOptions } from './total-attenuation';
export type { AttenuationComponents } from '../engine/p618-total-attenuation';
export type { AtmosphereLevel, SiteAtmosphere, SiteAtmosphereOptions } from './site-atmosphere';
export type { VapourAtOptions, WaterVapour } from './p836-6-water-vapour';
export type { ReducedCloudLiquidOptions } from './p840-8-cloud-liquid';
export type { MapCatalogue, MapEntry } from './map-catalogue';
export type { SiteCoordinates } from './site-input';
