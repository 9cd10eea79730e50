/**
 * ITU-R maps benchmark (`npm run bench:maps`): the first load of all 100 maps (time and resident
 * memory), then the mean time of one siteClimate and one siteAtmosphere look-up over 10 000
 * random sites between 60° S and 70° N (where customers can see a geostationary satellite).
 * Aims: look-up ≤ 50 µs, resident memory after loading ≤ 150 MB.
 */
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { preloadMaps, siteAtmosphere, siteClimate } from '../../server/climate-maps';

const SITES = 10_000;
const MB = 1024 * 1024;

// A fixed-seed generator, so every run times the same sites.
let seed = 0x9e3779b9;
function random(): number {
  seed = (seed + 0x6d2b79f5) | 0;
  let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
  t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}
const lats = Float64Array.from({ length: SITES }, () => -60 + 130 * random());
const lons = Float64Array.from({ length: SITES }, () => -180 + 360 * random());
const heights = Float64Array.from({ length: SITES }, () => 2 * random());

const rssBefore = process.memoryUsage().rss;
const t0 = performance.now();
const count = preloadMaps();
const loadMs = performance.now() - t0;
const rssAfter = process.memoryUsage().rss;

let sink = 0;
/** Mean wall and CPU time per call, µs: CPU time shows the work itself when other jobs share the two cores. */
function meanMicroseconds(run: (i: number) => number): { wall: number; cpu: number } {
  for (let i = 0; i < 2000; i++) sink += run(i % SITES);
  const cpu0 = process.cpuUsage();
  const t = performance.now();
  for (let i = 0; i < SITES; i++) sink += run(i);
  const wall = ((performance.now() - t) * 1000) / SITES;
  const cpu = process.cpuUsage(cpu0);
  return { wall, cpu: (cpu.user + cpu.system) / SITES };
}
const climate = meanMicroseconds((i) => siteClimate({ latDeg: lats[i], lonDeg: lons[i] }).r001MmH);
const atmosphere = meanMicroseconds((i) => siteAtmosphere({ latDeg: lats[i], lonDeg: lons[i], stationHeightKm: heights[i] }).levels[4].waterVapourContentKgM2);
const rssEnd = process.memoryUsage().rss;

const mb = (bytes: number): string => `${(bytes / MB).toFixed(0)} MB`;
const us = (t: { wall: number; cpu: number }): string => `${t.wall.toFixed(1)} µs (CPU ${t.cpu.toFixed(1)} µs)`;
console.log(`ITU-R maps (Node ${process.version}, one core, load average ${os.loadavg()[0].toFixed(1)}):`);
console.log(`  first load of all ${count} maps: ${loadMs.toFixed(0)} ms · resident memory ${mb(rssBefore)} → ${mb(rssAfter)}, the maps ${mb(rssAfter - rssBefore)}   aim ≤ 150 MB: ${rssAfter <= 150 * MB ? 'met' : 'NOT met'}${process.execArgv.some((a) => a.includes('tsx')) ? ' (tsx itself holds about 40 MB more than plain node)' : ''}`);
console.log(`  siteClimate, mean of ${SITES} random sites 60° S…70° N: ${us(climate)}   aim ≤ 50 µs: ${climate.wall <= 50 ? 'met' : 'NOT met'}`);
console.log(`  siteAtmosphere (18 levels), mean of ${SITES} sites: ${us(atmosphere)}`);
console.log(`  resident memory after the look-ups: ${mb(rssEnd)}${Number.isFinite(sink) ? '' : ' (!)'}`);
