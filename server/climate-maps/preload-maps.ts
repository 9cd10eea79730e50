import { loadGrid } from './grid';
import { mapCatalogue } from './map-catalogue';
import { vapourGridPointHeightsKm } from './p836-6-water-vapour';

/**
 * Loads every map of the catalogue (and the P.836-6 grid-point heights) now rather than on the
 * first look-up: for workers and benchmarks that want the cost paid up front. Returns the number
 * of maps held.
 *
 * @example
 * preloadMaps() // => 100
 */
export function preloadMaps(): number {
  const { maps } = mapCatalogue();
  for (const entry of maps) loadGrid(entry.file);
  vapourGridPointHeightsKm();
  return maps.length;
}
