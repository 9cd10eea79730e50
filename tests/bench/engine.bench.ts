/**
 * Engine benchmark (`npm run bench:engine`): first load of the ITU-R maps (time, resident
 * memory), one siteClimate look-up, one ITU-R P.618 A_p and inverse, one 8-dish trade-off
 * rain-only and with the P.618 §2.5 total from the site's maps, and the wall time of 10 000 sites ×
 * 8 dishes each with its own site climate and atmosphere, on one core (Node is single-threaded;
 * nothing here spawns workers). Scenario data are invented.
 * Aims: look-up ≤ 50 µs, 8-dish trade-off with the total ≤ 0.3 ms, 10 000 × 8 ≤ 5 s, maps ≤ 150 MB resident.
 */
import { performance } from 'node:perf_hooks';
import { preloadMaps, siteAtmosphere, siteClimate } from '../../server/climate-maps';
import { ENGINE_VERSION, dishTradeoff, prepareRainPath, rainAttenuation, rainExceedance, type TradeoffScenario } from '../../server/engine';

// Maps first, on a cold process, so the memory figure is the maps' own.
const rssBeforeMb = process.memoryUsage().rss / 2 ** 20;
const tLoad = performance.now();
preloadMaps();
const mapsLoadMs = performance.now() - tLoad;
const rssAfterMb = process.memoryUsage().rss / 2 ** 20;

const PATH = { latDeg: 51.5, stationHeightKm: 0.031382984, frequencyGHz: 14.25, elevationDeg: 31.07699124, tiltDeg: 0, r001MmH: 26.48052, rainHeightKm: 2.45273333 };
const DIAMETERS_M = [0.45, 0.6, 0.75, 0.9, 1.0, 1.2, 1.5, 1.8];

function scenario(lat: number, lon: number, r001: number, hR: number): TradeoffScenario {
  return {
    site: { latDeg: lat, lonDeg: lon, altitudeKm: 0.1 },
    satellite: { longitudeDeg: lon + 5 },
    downlink: { frequencyGHz: 11.7, tiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
    receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 35 },
    rain: { r001MmH: r001, rainHeightKm: hR },
    dishes: DIAMETERS_M.map((d, i) => ({ diameterM: d, efficiency: 0.65, priceUsd: (79.9 + 60 * i).toFixed(2), labourUsd: '120.00' })),
    targetAvailabilityPercent: 99.9,
  };
}

let sink = 0;

/** Median per-call time in ms over `samples` batches sized to ~`batchMs` each. */
function medianMs(run: (i: number) => number, samples = 41, batchMs = 20): number {
  let n = 1;
  for (;;) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += run(i);
    if (performance.now() - t0 > batchMs / 4 || n > 1e7) break;
    n *= 2;
  }
  n = Math.max(1, Math.round((n * batchMs) / Math.max(1e-3, (() => { const t0 = performance.now(); for (let i = 0; i < n; i++) sink += run(i); return performance.now() - t0; })())));
  const times: number[] = [];
  for (let s = 0; s < samples; s++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += run(i);
    times.push((performance.now() - t0) / n);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

function fmt(ms: number): string {
  return ms < 0.01 ? `${(ms * 1000).toFixed(2)} µs` : `${ms.toFixed(4)} ms`;
}

const ps = Array.from({ length: 64 }, (_, i) => Math.min(5, 0.001 * Math.exp((i / 63) * Math.log(5000))));
const attenuations = ps.map((p) => rainAttenuation({ ...PATH, pPercent: p }));
const tradeoffScenarios = Array.from({ length: 64 }, (_, i) => scenario(35 + (i % 16), -5 + (i % 11), 20 + (i % 7) * 8, 2.5 + (i % 5) * 0.4));

// Warm-up so the JIT has compiled the hot paths before anything is timed.
for (let i = 0; i < 3000; i++) sink += dishTradeoff(tradeoffScenarios[i & 63]).options[0].outagePercent + rainExceedance({ ...PATH, attenuationDb: attenuations[i & 63] }).pPercent;

const apMs = medianMs((i) => rainAttenuation({ ...PATH, pPercent: ps[i & 63] }));
const inverseMs = medianMs((i) => rainExceedance({ ...PATH, attenuationDb: attenuations[i & 63] }).pPercent);
const prepared = prepareRainPath(PATH);
const preparedInverseMs = medianMs((i) => prepared.exceedanceOf(attenuations[i & 63]).pPercent);
const tradeoffMs = medianMs((i) => dishTradeoff(tradeoffScenarios[i & 63]).options[3].outagePercent, 21, 50);

/** A scenario whose climate and atmosphere come from the maps at (lat, lon), as a study or campaign row builds it. */
function mapsScenario(lat: number, lon: number): TradeoffScenario {
  const c = siteClimate({ latDeg: lat, lonDeg: lon });
  const h = Math.max(0, c.topographicHeightKm);
  const base = scenario(lat, lon, 0, 0);
  return {
    ...base,
    site: { latDeg: lat, lonDeg: lon, altitudeKm: h },
    rain: { monthlyRainfallMm: c.monthlyRainfallMm, monthlyTemperatureC: c.monthlyTemperatureC, origin: 'itu-r-maps', zeroIsothermHeightKm: c.isothermHeightKm },
    atmosphere: siteAtmosphere({ latDeg: lat, lonDeg: lon, stationHeightKm: h }),
  };
}
const lookupSites = Array.from({ length: 1024 }, (_, i) => [-50 + ((i * 37) % 110), -170 + ((i * 53) % 340)] as const);
for (let i = 0; i < 2000; i++) sink += siteClimate({ latDeg: lookupSites[i & 1023][0], lonDeg: lookupSites[i & 1023][1] }).r001MmH;
const lookupMs = medianMs((i) => siteClimate({ latDeg: lookupSites[i & 1023][0], lonDeg: lookupSites[i & 1023][1] }).r001MmH);
const totalScenarios = Array.from({ length: 64 }, (_, i) => mapsScenario(35 + (i % 16), -5 + (i % 11)));
for (let i = 0; i < 2000; i++) sink += dishTradeoff(totalScenarios[i & 63]).options[0].outagePercent;
const totalTradeoffMs = medianMs((i) => dishTradeoff(totalScenarios[i & 63]).options[3].outagePercent, 21, 50);

// Batch: 10 000 invented sites × 8 dishes, one after another on this one thread.
let seed = 12345;
const rand = (): number => {
  seed = (seed * 1103515245 + 12345) % 2147483648;
  return seed / 2147483648;
};
const sites = Array.from({ length: 10_000 }, () => scenario(-55 + 110 * rand(), -180 + 360 * rand(), 5 + 120 * rand(), 1.5 + 3.9 * rand()));
const t0 = performance.now();
let minutes = 0;
for (const s of sites) {
  const r = dishTradeoff(s);
  for (const o of r.options) minutes += o.outageMinutesPerYear;
}
const batchS = (performance.now() - t0) / 1000;
sink += minutes;

// The same batch as a campaign runs it: each site's climate and atmosphere read from the maps.
const mapSites: [number, number][] = [];
while (mapSites.length < 10_000) {
  const lat = -55 + 115 * rand();
  const lon = -180 + 360 * rand();
  mapSites.push([lat, lon]);
}
const t1 = performance.now();
let totalMinutes = 0;
let refused = 0;
for (const [lat, lon] of mapSites) {
  try {
    const r = dishTradeoff(mapsScenario(lat, lon));
    for (const o of r.options) totalMinutes += o.outageMinutesPerYear;
  } catch {
    refused++; // satellite below the horizon for this invented slot: counted, as a campaign would
  }
}
const mapsBatchS = (performance.now() - t1) / 1000;
sink += totalMinutes;

console.log(`FadeLedger engine ${ENGINE_VERSION} benchmark (Node ${process.version}, one core)`);
console.log(`  first load of all ITU-R maps                  ${mapsLoadMs.toFixed(0)} ms, resident ${rssBeforeMb.toFixed(0)} → ${rssAfterMb.toFixed(0)} MB (maps +${(rssAfterMb - rssBeforeMb).toFixed(0)} MB)   aim ≤ 150 MB: ${rssAfterMb <= 150 ? 'met' : 'NOT met'}`);
console.log(`  one siteClimate look-up (P.837-7 Annex 1 …)  median ${fmt(lookupMs)}   aim ≤ 50 µs: ${lookupMs <= 0.05 ? 'met' : 'NOT met'}`);
console.log(`  one A_p (rainAttenuation, validated)          median ${fmt(apMs)}`);
console.log(`  one inverse (rainExceedance, Brent on ln p)  median ${fmt(inverseMs)}`);
console.log(`  one inverse on a prepared path (per dish)     median ${fmt(preparedInverseMs)}`);
console.log(`  one 8-dish trade-off, rain only              median ${fmt(tradeoffMs)}`);
console.log(`  one 8-dish trade-off with the P.618 §2.5 total median ${fmt(totalTradeoffMs)}   aim ≤ 0.3 ms: ${totalTradeoffMs <= 0.3 ? 'met' : 'NOT met'}`);
console.log(`  batch 10 000 sites × 8 dishes, rain only      ${batchS.toFixed(2)} s (${Math.round(10_000 / batchS)} trade-offs/s)`);
console.log(`  batch 10 000 sites × 8 dishes, each with its own site climate + atmosphere from the maps, total attenuation   ${mapsBatchS.toFixed(2)} s (${Math.round(10_000 / mapsBatchS)} sites/s; ${refused} refused: satellite below the horizon)   aim ≤ 5 s: ${mapsBatchS <= 5 ? 'met' : 'NOT met'}`);
if (!Number.isFinite(sink)) console.log('  (checksum not finite!)');
