import { EngineInputError } from './errors';
import { requireNumberInRange } from './validate';

/** One tabulated time percentage of the site's atmosphere (ITU-R P.836-6 and P.840-8 maps). */
export interface AtmosphereLevel {
  /** Exceedance probability of the level, % (the maps' tabulated 0.1 … 99 %). */
  pPercent: number;
  /** Surface water-vapour density ρ exceeded for p %, at the station height, g/m³ (P.836-6). */
  surfaceVapourDensityGM3: number;
  /** Total columnar water-vapour content V exceeded for p %, at the station height, kg/m² (P.836-6). */
  waterVapourContentKgM2: number;
  /** Reduced cloud liquid water content L_red exceeded for p %, kg/m² (P.840-8). */
  reducedCloudLiquidKgM2: number;
}

/**
 * The site's atmosphere as read from the ITU-R maps at its coordinates and station height
 * (server/climate-maps hands it to the engine; the engine does no I/O).
 */
export interface SiteAtmosphere {
  /** Annual mean surface temperature, K (ITU-R P.1510-1). */
  surfaceTemperatureK: number;
  /** Median wet term of the surface refractivity N_wet (ITU-R P.453-14). */
  nWetMedian: number;
  /** Levels in ascending p, at least two, the first at or below 1 %. */
  levels: readonly AtmosphereLevel[];
}

/** The atmosphere at one p: ρ, V and L_red. */
export interface AtmosphereAtP {
  surfaceVapourDensityGM3: number;
  waterVapourContentKgM2: number;
  reducedCloudLiquidKgM2: number;
}

/**
 * Check a site atmosphere before any arithmetic (engine rule: a physical range for every input).
 * Bad input: EngineInputError naming `${prefix}…` (e.g. `atmosphere.levels[3].pPercent`).
 */
export function checkSiteAtmosphere(raw: unknown, prefix = 'atmosphere.'): SiteAtmosphere {
  return isValidAtmosphere(raw) ? raw : checkSiteAtmosphereNaming(raw, prefix);
}

const within = (v: unknown, min: number, max: number): v is number => typeof v === 'number' && Number.isFinite(v) && v >= min && v <= max;

/**
 * The same checks as checkSiteAtmosphereNaming without building a field name per value or copying
 * the levels: a campaign checks one atmosphere per site, and the names and copies (up to 160
 * strings, 40 objects) cost more than the site's physics. The engine only reads the atmosphere
 * during the call, so a valid one is used as given; on any failure the naming check runs and
 * throws the exact error.
 */
function isValidAtmosphere(raw: unknown): raw is SiteAtmosphere {
  if (raw === null || typeof raw !== 'object') return false;
  const a = raw as Record<string, unknown>;
  const levels = a.levels;
  if (!within(a.surfaceTemperatureK, 180, 330) || !within(a.nWetMedian, 0, 200) || !Array.isArray(levels) || levels.length < 2 || levels.length > 40) return false;
  let last = 0;
  for (let i = 0; i < levels.length; i++) {
    const r = levels[i] as Record<string, unknown> | null;
    if (r === null || typeof r !== 'object') return false;
    const p = r.pPercent;
    if (!within(p, 0.001, 100) || p <= last || (i === 0 && p > 1)) return false;
    if (!within(r.surfaceVapourDensityGM3, 0, 60) || !within(r.waterVapourContentKgM2, 0, 100) || !within(r.reducedCloudLiquidKgM2, 0, 20)) return false;
    last = p;
  }
  return true;
}

/** The checks with every field named, for the error message; also the reference for the fast copy above. */
function checkSiteAtmosphereNaming(raw: unknown, prefix: string): SiteAtmosphere {
  if (raw === null || typeof raw !== 'object') throw new EngineInputError(prefix.replace(/\.$/, ''), 'a site atmosphere object is required', raw);
  const a = raw as Record<string, unknown>;
  const surfaceTemperatureK = requireNumberInRange(a.surfaceTemperatureK, `${prefix}surfaceTemperatureK`, 180, 330);
  const nWetMedian = requireNumberInRange(a.nWetMedian, `${prefix}nWetMedian`, 0, 200);
  if (!Array.isArray(a.levels) || a.levels.length < 2 || a.levels.length > 40) {
    throw new EngineInputError(`${prefix}levels`, 'give 2 to 40 tabulated levels in ascending p', a.levels);
  }
  let last = 0;
  const levels = a.levels.map((l: unknown, i: number): AtmosphereLevel => {
    const f = `${prefix}levels[${i}]`;
    if (l === null || typeof l !== 'object') throw new EngineInputError(f, 'is required', l);
    const r = l as Record<string, unknown>;
    const pPercent = requireNumberInRange(r.pPercent, `${f}.pPercent`, 0.001, 100);
    if (pPercent <= last) throw new EngineInputError(`${f}.pPercent`, 'levels must be in strictly ascending p', pPercent);
    last = pPercent;
    return {
      pPercent,
      surfaceVapourDensityGM3: requireNumberInRange(r.surfaceVapourDensityGM3, `${f}.surfaceVapourDensityGM3`, 0, 60),
      waterVapourContentKgM2: requireNumberInRange(r.waterVapourContentKgM2, `${f}.waterVapourContentKgM2`, 0, 100),
      reducedCloudLiquidKgM2: requireNumberInRange(r.reducedCloudLiquidKgM2, `${f}.reducedCloudLiquidKgM2`, 0, 20),
    };
  });
  if (levels[0].pPercent > 1) throw new EngineInputError(`${prefix}levels[0].pPercent`, 'the first level must be at or below 1 % (the total holds gases and clouds at 1 %)', levels[0].pPercent);
  return { surfaceTemperatureK, nWetMedian, levels };
}

/**
 * ρ, V and L_red at p: linear in ln p between the tabulated levels around p (the rule of the
 * ITU-R P.836-6 and P.840-8 maps); held at the first level below it, as the ITU-R SG 3
 * validation examples of P.618-13 §2.5 do below the smallest tabulated p (0.1 %).
 *
 * Bad input: p above the last level throws EngineInputError('pPercent'); levels are checked already.
 *
 * @example
 * atmosphereAt(levels, 0.05) // => the 0.1 % level's values
 */
export function atmosphereAt(levels: readonly AtmosphereLevel[], pPercent: number): AtmosphereAtP {
  const first = levels[0];
  if (pPercent <= first.pPercent) return first;
  const lastLevel = levels[levels.length - 1];
  if (!(pPercent <= lastLevel.pPercent)) throw new EngineInputError('pPercent', `must be at most ${lastLevel.pPercent} % (the last tabulated level); got ${pPercent}`, pPercent);
  let i = 1;
  while (levels[i].pPercent < pPercent) i++;
  const lo = levels[i - 1];
  const hi = levels[i];
  const w = Math.log(pPercent / lo.pPercent) / Math.log(hi.pPercent / lo.pPercent);
  return {
    surfaceVapourDensityGM3: lo.surfaceVapourDensityGM3 + w * (hi.surfaceVapourDensityGM3 - lo.surfaceVapourDensityGM3),
    waterVapourContentKgM2: lo.waterVapourContentKgM2 + w * (hi.waterVapourContentKgM2 - lo.waterVapourContentKgM2),
    reducedCloudLiquidKgM2: lo.reducedCloudLiquidKgM2 + w * (hi.reducedCloudLiquidKgM2 - lo.reducedCloudLiquidKgM2),
  };
}
