import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { mapEntry, type MapEntry } from './map-catalogue';
import { mapsDir } from './maps-dir';

/** A map held in memory: its catalogue entry and its float32 values, row-major. */
export interface Grid {
  entry: MapEntry;
  values: Float32Array;
}

/** Fractional (row, column) of a site on a grid: row `y` and column `x` count from 0. */
export interface GridPosition {
  y: number;
  x: number;
}

/** Room past the grid's size so gunzip finds the end of the stream without starting a second chunk. */
const GUNZIP_SLACK_BYTES = 64;

// Immutable data shared by every request of the process: read once, never written after.
const grids = new Map<string, Grid>();
let loads = 0;

/**
 * The grid of one map file, decompressed on first use and kept for the life of the process.
 * Values stay Float32Array (half the memory of numbers; 100 maps fit in about 75 MB).
 *
 * @example
 * loadGrid('p839-4-isotherm-height.f32.gz').values.length // => 121 * 241
 */
export function loadGrid(file: string): Grid {
  const cached = grids.get(file);
  if (cached) return cached;
  const entry = mapEntry(file);
  const expected = entry.rows * entry.cols * 4;
  // One output chunk a little larger than the grid: gunzip then fills a single buffer instead of
  // gathering 16 KB pieces and copying them, which would briefly double the memory of each map.
  const bytes = zlib.gunzipSync(fs.readFileSync(path.join(mapsDir(), file)), { chunkSize: expected + GUNZIP_SLACK_BYTES });
  if (bytes.length !== expected) throw new Error(`${file}: ${bytes.length} bytes, maps.json promises ${expected}`);
  // The files are little-endian; a big-endian host must swap before viewing them as floats.
  if (os.endianness() === 'BE') bytes.swap32();
  // Float32Array needs 4-byte alignment; gunzip's buffer normally has it, a pooled slice might not.
  const aligned = bytes.byteOffset % 4 === 0 ? bytes : Buffer.from(bytes);
  const grid: Grid = { entry, values: new Float32Array(aligned.buffer, aligned.byteOffset, entry.rows * entry.cols) };
  grids.set(file, grid);
  loads++;
  return grid;
}

/**
 * How many grid files this process has read from disk so far (tests check that a second
 * look-up reads nothing).
 *
 * @example
 * gridLoadCount() // => 0 before the first look-up
 */
export function gridLoadCount(): number {
  return loads;
}

/**
 * Longitude moved by whole turns into [start, start + 360).
 *
 * @example
 * wrapLongitude(-0.14, 0)          // => 359.86
 * wrapLongitude(359.9, -180.125)   // => -0.1 (to rounding)
 */
export function wrapLongitude(lonDeg: number, startDeg: number): number {
  let w = lonDeg - startDeg;
  w -= 360 * Math.floor(w / 360);
  // A tiny negative w rounds to exactly 360 above; that longitude is the start itself.
  if (w >= 360) w -= 360;
  return startDeg + w;
}

/**
 * Fractional row and column of (lat, lon) on a grid, in the grid's own latitude direction,
 * with longitude wrapped into [lonStartDeg, lonStartDeg + 360) (the grid's first column unless
 * a Recommendation says otherwise, as P.1511-1 does with [0, 360)).
 *
 * @example
 * gridPosition(mapEntry('p839-4-isotherm-height.f32.gz'), 51.5, -0.14) // => { y: 25.666…, x: 239.906… }
 */
export function gridPosition(entry: MapEntry, latDeg: number, lonDeg: number, lonStartDeg = entry.firstLonDeg): GridPosition {
  return {
    y: (latDeg - entry.firstLatDeg) / entry.latStepDeg,
    x: (wrapLongitude(lonDeg, lonStartDeg) - entry.firstLonDeg) / entry.lonStepDeg,
  };
}

/**
 * Throws unless every grid has the first one's rows, columns, origin and steps.
 *
 * @example
 * requireSameGeometry([gridA, gridB]) // passes when both are 161 × 321 from 90° N, 0° E
 */
export function requireSameGeometry(list: readonly Grid[]): void {
  const a = list[0].entry;
  for (const { entry: b } of list) {
    if (a.rows !== b.rows || a.cols !== b.cols || a.firstLatDeg !== b.firstLatDeg || a.latStepDeg !== b.latStepDeg || a.firstLonDeg !== b.firstLonDeg || a.lonStepDeg !== b.lonStepDeg) {
      throw new Error(`maps.json: ${b.file} does not share the grid of ${a.file}`);
    }
  }
}
