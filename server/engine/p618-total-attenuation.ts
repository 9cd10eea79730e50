import { brentRoot } from './math/brent';
import { sampleCurve, scanGrid, type SampledCurve } from './math/largest-crossing';
import { gasSlantPathAttenuation } from './p676-12-gas-slant-path';
import { standardPressureHpaP835 } from './p835-standard-pressure';
import { cloudMassAbsorptionUnchecked, CLOUD_LIQUID_TEMPERATURE_K_P840_8 } from './p840-8-cloud-attenuation';
import { scintillationSigmaUnchecked, scintillationTimeFactor, scintillationTimeFactorLn } from './p618-scintillation';
import { exceedanceOnCurve, MAX_P_PERCENT_P618_14, MIN_P_PERCENT_P618_14, prepareRainPathUnchecked, type RainExceedance, type RainPath } from './p618-rain-path';
import { atmosphereAt, type SiteAtmosphere } from './site-atmosphere';

/** Below this p the total holds gases and clouds at their 1 % values (ITU-R P.618-14 §2.5). */
export const HELD_BELOW_P_PERCENT_P618_14 = 1;
/** Smallest elevation for P.676-12 Annex 2 and P.840-8 slant paths (1/sin θ), degrees. */
export const MIN_ELEVATION_DEG_ATMOSPHERE = 5;
/** Memo entries kept per path (the sample grid is shared by every dish of a study). */
const MEMO_LIMIT = 512;
const DEG = Math.PI / 180;
const LN_P_MIN = Math.log(MIN_P_PERCENT_P618_14);
const LN_P_MAX = Math.log(MAX_P_PERCENT_P618_14);
const LN_P_HELD = Math.log(HELD_BELOW_P_PERCENT_P618_14);
/** Within 1e-8 in ln of A_T(5 %) is the range end itself (rounding, not physics), as for rain alone. */
const RANGE_END_SNAP_LN = 1e-8;
/** A total of exactly 0 dB has no logarithm; this floor keeps ln finite and below any real threshold. */
const LN_FLOOR = -690;

/** The attenuation of each mechanism, and their combination, exceeded for p % of an average year. */
export interface AttenuationComponents {
  /** Gases, P.676-12 Annex 2 (reported at p; held at its 0.1 % value below 0.1 %), dB. */
  gasDb: number;
  /** Clouds, P.840-8 (reported at p; held at its 0.1 % value below 0.1 %), dB. */
  cloudDb: number;
  /** Rain, P.618-14 §2.2.1.1, dB. */
  rainDb: number;
  /** Tropospheric scintillation, P.618-14 §2.4.1 a(p)·σ, dB. */
  scintillationDb: number;
  /** P.618-14 §2.5: A_G + √((A_R + A_C)² + A_S²), gases and clouds at their 1 % values for p < 1 %, dB. */
  totalDb: number;
}

/** Gases and clouds along one slant path at one frequency: the part of the total no dish changes. */
export interface AtmosphericPath {
  /** Station pressure, hPa (P.835 standard atmosphere at the station height). */
  readonly pressureHpa: number;
  /** A_G(p) and A_C(p), dB, for 0.001 ≤ p ≤ the last tabulated level (held below the first). */
  gasAt(pPercent: number): number;
  cloudAt(pPercent: number): number;
}

/**
 * Prepare gases (ITU-R P.676-12 Annex 2: surface ρ(p) and V(p) from P.836-6, T from P.1510-1,
 * pressure from the P.835 standard atmosphere at the station height) and clouds (P.840-8:
 * L_red(p) K_l(f, 0 °C)/sin θ) for one path. Values are memoised per p (a study's dishes all
 * sample the same p grid).
 *
 * Bad input: callers validate the frequency, θ ≥ 5°, the station height (−0.5–9 km) and the
 * atmosphere (checkSiteAtmosphere) first.
 *
 * @example
 * prepareAtmosphericPath({ frequencyGHz: 14.25, elevationDeg: 31.08, stationHeightKm: 0.031, atmosphere }).gasAt(1) // => 0.2269 dB at site V8
 */
export function prepareAtmosphericPath(o: { frequencyGHz: number; elevationDeg: number; stationHeightKm: number; atmosphere: SiteAtmosphere }): AtmosphericPath {
  const pressureHpa = standardPressureHpaP835(Math.max(0, o.stationHeightKm));
  const kl = cloudMassAbsorptionUnchecked(o.frequencyGHz, CLOUD_LIQUID_TEMPERATURE_K_P840_8);
  const sinT = Math.sin(o.elevationDeg * DEG);
  const gasMemo = new Map<number, number>();
  const cloudMemo = new Map<number, number>();
  const remember = (memo: Map<number, number>, p: number, v: number): number => {
    if (memo.size >= MEMO_LIMIT) memo.clear();
    memo.set(p, v);
    return v;
  };
  const firstLevelP = o.atmosphere.levels[0].pPercent;
  const gasAt = (pPercent: number): number => {
    // Below the first tabulated level the value is held: one memo entry serves every such p.
    const p = Math.max(pPercent, firstLevelP);
    const hit = gasMemo.get(p);
    if (hit !== undefined) return hit;
    const a = atmosphereAt(o.atmosphere.levels, p);
    const g = gasSlantPathAttenuation({
      frequencyGHz: o.frequencyGHz,
      elevationDeg: o.elevationDeg,
      pressureHpa,
      temperatureK: o.atmosphere.surfaceTemperatureK,
      surfaceVapourDensityGM3: a.surfaceVapourDensityGM3,
      waterVapourContentKgM2: a.waterVapourContentKgM2,
      stationHeightKm: Math.max(0, o.stationHeightKm),
    }).totalDb;
    return remember(gasMemo, p, g);
  };
  const cloudAt = (pPercent: number): number => {
    const p = Math.max(pPercent, firstLevelP);
    const hit = cloudMemo.get(p);
    if (hit !== undefined) return hit;
    return remember(cloudMemo, p, (atmosphereAt(o.atmosphere.levels, p).reducedCloudLiquidKgM2 * kl) / sinT);
  };
  return { pressureHpa, gasAt, cloudAt };
}

/**
 * The part of the below-1 % scan that no dish changes: A_R on the grid of sampleCurve for one rain
 * path. Every dish of a site scans the same grid on the same rain path, so dishTradeoff works this
 * out once per path and hands it to each dish's curve (a campaign site's 8 dishes work out rain
 * once instead of 8 times); the values are the very numbers the per-dish scan computed, so the
 * figures are bit-identical. Handed over explicitly rather than cached in a module-level table:
 * such a table kept every site's paths alive through young-generation collections.
 */
export function rainOnHeldScan(rainPath: RainPath): readonly number[] {
  const xs = scanGrid(LN_P_MIN, LN_P_HELD);
  const values: number[] = [];
  for (let i = 0; i < xs.length; i++) values.push(Math.exp(rainPath.lnAttenuationAt(xs[i])));
  return values;
}
/** a(p) of §2.4.1 step 8 on the same grid: the same for every path. */
let heldGridScintillation: readonly number[] | null = null;
function scintillationOnHeldGrid(): readonly number[] {
  if (!heldGridScintillation) heldGridScintillation = scanGrid(LN_P_MIN, LN_P_HELD).map(scintillationTimeFactorLn);
  return heldGridScintillation;
}

/** The total attenuation of one dish's path and its inverse. */
export interface TotalAttenuationCurve {
  componentsAt(pPercent: number): AttenuationComponents;
  totalAt(pPercent: number): number;
  /** The largest p in 0.001–5 % whose total reaches the attenuation, with the model-range bounds of RainExceedance. */
  exceedanceOf(attenuationDb: number): RainExceedance;
  /** Largest total over the model range, dB. */
  readonly maxAttenuationDb: number;
}

/**
 * ITU-R P.618-14 §2.5 total attenuation for one dish: A_T(p) = A_G(p) + √((A_R(p) + A_C(p))² + A_S(p)²),
 * with A_G and A_C at their 1 % values for p < 1 %, A_S(p) = a(p)·σ following the §2.4.1 step 8
 * polynomial below 0.01 % as well (the ITU-R SG 3 validation examples of §2.5 do so at 0.001 %;
 * a(p) keeps rising smoothly there, so holding it flat would understate the deepest fades).
 * The inverse is the largest p whose total reaches the fade threshold (see sampleCurve), because
 * step 10 of the rain model is not monotone everywhere.
 *
 * Bad input: the rain and atmospheric paths come prepared; σ ≥ 0 is validated by the caller.
 *
 * @example
 * totalAttenuationCurve({ rainPath, atmosphericPath, scintillationSigmaDb: 0.0873 }).componentsAt(0.01).totalDb // => 7.5073 at site V8, 14.25 GHz
 */
export function totalAttenuationCurve(o: {
  rainPath: RainPath;
  atmosphericPath: AtmosphericPath | null;
  scintillationSigmaDb: number;
  /** rainOnHeldScan(rainPath), when the caller shares it between dishes; else worked out here. */
  rainOnHeldScan?: readonly number[];
}): TotalAttenuationCurve {
  const atm = o.atmosphericPath;
  const gasHeld = atm ? atm.gasAt(HELD_BELOW_P_PERCENT_P618_14) : 0;
  const cloudHeld = atm ? atm.cloudAt(HELD_BELOW_P_PERCENT_P618_14) : 0;
  const sigma = o.scintillationSigmaDb;
  const totalAt = (p: number): number => totalAtLn(p, Math.log(p));
  /** A_T at p, with ln p given too (the solvers have it). */
  const totalAtLn = (p: number, lp: number): number => {
    const below = p < HELD_BELOW_P_PERCENT_P618_14;
    const g = atm ? (below ? gasHeld : atm.gasAt(p)) : 0;
    const c = atm ? (below ? cloudHeld : atm.cloudAt(p)) : 0;
    const rc = Math.exp(o.rainPath.lnAttenuationAt(lp)) + c;
    const s = sigma > 0 ? sigma * scintillationTimeFactorLn(lp) : 0;
    return g + Math.sqrt(rc * rc + s * s);
  };
  const componentsAt = (p: number): AttenuationComponents => ({
    gasDb: atm ? atm.gasAt(p) : 0,
    cloudDb: atm ? atm.cloudAt(p) : 0,
    rainDb: o.rainPath.attenuationAt(p),
    scintillationDb: sigma > 0 ? sigma * scintillationTimeFactor(p) : 0,
    totalDb: totalAt(p),
  });
  const lnTotal = (lp: number): number => {
    const t = totalAtLn(Math.exp(lp), lp);
    return t > 0 ? Math.log(t) : LN_FLOOR;
  };
  // Below 1 % gases and clouds are held, so sampling there costs no gas evaluation; that is also
  // the only stretch where step 10 of the rain model can turn (just above 0.001 %).
  let curve: SampledCurve | null = null;
  // On the grid p < 1 % except at its top point, where p = 1 and gasAt(1)/cloudAt(1) are the held values.
  const sampledBelowHeld = (): SampledCurve => {
    if (curve) return curve;
    const rain = o.rainOnHeldScan ?? rainOnHeldScan(o.rainPath);
    const scint = scintillationOnHeldGrid();
    const lnTotalOnGrid = (i: number): number => {
      const rc = rain[i] + cloudHeld;
      const s = sigma > 0 ? sigma * scint[i] : 0;
      const t = gasHeld + Math.sqrt(rc * rc + s * s);
      return t > 0 ? Math.log(t) : LN_FLOOR;
    };
    return (curve = sampleCurve(lnTotal, LN_P_MIN, LN_P_HELD, lnTotalOnGrid));
  };
  const exceedanceOf = (a: number): RainExceedance => {
    if (!(a > 0)) return { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
    const lnA = Math.log(a);
    if (lnA <= lnTotal(LN_P_HELD)) {
      // From 1 % to 5 % every component falls with p (β = 0 in step 10; ρ, V and L_red fall with
      // p on the maps; a(p) falls): one crossing at most, and it is the largest p.
      const lnAt5 = lnTotal(LN_P_MAX);
      if (lnA <= lnAt5) return lnA >= lnAt5 - RANGE_END_SNAP_LN ? { pPercent: MAX_P_PERCENT_P618_14, bound: 'none' } : { pPercent: MAX_P_PERCENT_P618_14, bound: 'above-model-range' };
      const lp = brentRoot((x) => lnTotal(x) - lnA, LN_P_HELD, LN_P_MAX, 1e-12);
      return { pPercent: Math.min(MAX_P_PERCENT_P618_14, Math.max(HELD_BELOW_P_PERCENT_P618_14, Math.exp(lp))), bound: 'none' };
    }
    return exceedanceOnCurve(sampledBelowHeld(), Number.NEGATIVE_INFINITY, a);
  };
  return {
    componentsAt,
    totalAt,
    exceedanceOf,
    get maxAttenuationDb(): number {
      return Math.exp(sampledBelowHeld().peak);
    },
  };
}

/** One dish's slant path, as {@link slantPathTotalCurve} takes it. */
export interface SlantPathTotalOptions {
  latDeg: number;
  stationHeightKm: number;
  frequencyGHz: number;
  /** θ ≥ 5° (checked by the caller: gases, clouds and scintillation start there). */
  elevationDeg: number;
  tiltDeg: number;
  r001MmH: number;
  rainHeightKm: number;
  atmosphere: SiteAtmosphere;
  diameterM: number;
  efficiency: number;
}

/**
 * The P.618-14 §2.5 total curve of one dish on one path, set up from its inputs: the rain path
 * (§2.2.1.1), gases and clouds, and the dish's own scintillation σ (§2.4.1). dishTradeoff prepares
 * the dish-independent paths once for all its dishes; this is the same set-up for a single dish
 * (the public totalAttenuation from coordinates, a study's exceedance chart).
 *
 * Bad input: callers validate (checkRainPathOptions, checkSiteAtmosphere, θ ≥ 5°) first.
 *
 * @example
 * slantPathTotalCurve({ ...siteV8, frequencyGHz: 14.25, atmosphere, diameterM: 1, efficiency: 0.65 }).componentsAt(0.01).totalDb // => 7.5073
 */
export function slantPathTotalCurve(o: SlantPathTotalOptions): TotalAttenuationCurve {
  const { atmosphere, diameterM, efficiency, ...path } = o;
  return totalAttenuationCurve({
    rainPath: prepareRainPathUnchecked(path),
    atmosphericPath: prepareAtmosphericPath({ frequencyGHz: o.frequencyGHz, elevationDeg: o.elevationDeg, stationHeightKm: o.stationHeightKm, atmosphere }),
    scintillationSigmaDb: scintillationSigmaUnchecked(o.frequencyGHz, o.elevationDeg, diameterM, efficiency, atmosphere.nWetMedian),
  });
}
