import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { mapsDir } from './maps-dir';

/** One ITU-R digital map as maps.json describes it. */
export interface MapEntry {
  /** File name inside the data folder, e.g. `p839-4-isotherm-height.f32.gz`. */
  file: string;
  /** e.g. `ITU-R P.839-4`. */
  recommendation: string;
  quantity: string;
  unit: string;
  rows: number;
  cols: number;
  /** Latitude of row 0, degrees. */
  firstLatDeg: number;
  /** Signed latitude step per row: negative where the grid runs north to south. */
  latStepDeg: number;
  /** Longitude of column 0, degrees (−180… or 0… grids). */
  firstLonDeg: number;
  lonStepDeg: number;
  interpolation: string;
  /** Month 1…12 of the monthly P.837-7 and P.1510-1 maps. */
  month?: number;
  /** Tabulated exceedance percentage of the P.836-6 and P.840-8 maps. */
  pPercent?: number;
}

/** maps.json: the index of every grid in the data folder. */
export interface MapCatalogue {
  format: string;
  maps: readonly MapEntry[];
}

interface LoadedCatalogue {
  catalogue: MapCatalogue;
  byFile: Map<string, MapEntry>;
  version: string;
}

/** Hex digits of the maps.json hash kept in the version: enough to tell data releases apart. */
const VERSION_HEX_DIGITS = 12;

let loaded: LoadedCatalogue | null = null;

function load(): LoadedCatalogue {
  if (loaded) return loaded;
  const text = fs.readFileSync(path.join(mapsDir(), 'maps.json'));
  const catalogue = JSON.parse(text.toString('utf8')) as MapCatalogue;
  const byFile = new Map<string, MapEntry>();
  for (const entry of catalogue.maps) {
    checkEntry(entry);
    byFile.set(entry.file, entry);
  }
  const version = createHash('sha256').update(text).digest('hex').slice(0, VERSION_HEX_DIGITS);
  return (loaded = { catalogue, byFile, version });
}

// A malformed catalogue would give silently wrong figures everywhere, so it stops the process early.
function checkEntry(entry: MapEntry): void {
  const numbers = [entry.rows, entry.cols, entry.firstLatDeg, entry.latStepDeg, entry.firstLonDeg, entry.lonStepDeg];
  if (typeof entry.file !== 'string' || !numbers.every(Number.isFinite) || entry.latStepDeg === 0 || entry.lonStepDeg <= 0) {
    throw new Error(`maps.json: malformed entry ${JSON.stringify(entry)}`);
  }
}

/**
 * The parsed maps.json, read once per process.
 *
 * @example
 * mapCatalogue().maps.length // => 100
 */
export function mapCatalogue(): MapCatalogue {
  return load().catalogue;
}

/**
 * The catalogue entry of one grid file; throws if maps.json does not list it.
 *
 * @example
 * mapEntry('p839-4-isotherm-height.f32.gz').latStepDeg // => -1.5
 */
export function mapEntry(file: string): MapEntry {
  const entry = load().byFile.get(file);
  if (!entry) throw new Error(`maps.json lists no map ${file}`);
  return entry;
}

/**
 * The file of the map whose name starts with `prefix` and whose month or tabulated p matches.
 *
 * @example
 * mapFileFor('p836-6-vapour-scale-height-', { pPercent: 0.1 }) // => 'p836-6-vapour-scale-height-p01.f32.gz'
 */
export function mapFileFor(prefix: string, key: { month?: number; pPercent?: number }): string {
  const entry = load().catalogue.maps.find(
    (m) => m.file.startsWith(prefix) && (key.month === undefined || m.month === key.month) && (key.pPercent === undefined || m.pPercent === key.pPercent),
  );
  if (!entry) throw new Error(`maps.json lists no map ${prefix} for ${JSON.stringify(key)}`);
  return entry.file;
}

/**
 * First 12 hex digits of the SHA-256 of maps.json: stored with a study so it records which map
 * data it was computed from.
 *
 * @example
 * MAP_DATA_VERSION // => 'e3a8d14b4665' (the maps.json in server/climate-maps/data)
 */
export const MAP_DATA_VERSION: string = load().version;

/**
 * The distinct Recommendations whose maps the data folder holds, in catalogue order.
 *
 * @example
 * mapRecommendations.includes('ITU-R P.839-4') // => true
 */
export const mapRecommendations: readonly string[] = Object.freeze([...new Set(load().catalogue.maps.map((m) => m.recommendation))]);
