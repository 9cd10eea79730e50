import { EngineInputError } from './errors';
import { PHYSICAL_RANGES } from './physical-ranges';
import { measuredRainCurve, type MeasuredRainPoint } from './measured-rain-curve';
import { climateZoneRainRate, isClimateZone, type ClimateZone } from './p837-1-climate-zones';
import { monthlyRainClimate } from './p837-7-monthly-climate';
import { requireNumberInRange } from './validate';

/** Rain height inputs shared by every climate source (ITU-R P.839-4). */
export interface RainHeightInput {
  /** Mean rain height h_R, km. Takes precedence. */
  rainHeightKm?: number;
  /** Mean 0 °C isotherm height h_0, km; h_R = h_0 + 0.36 km. */
  zeroIsothermHeightKm?: number;
}

/** The four rain-climate sources of server/engine/README.md §1; give exactly one. */
export type RainClimateInput =
  | ({ r001MmH: number } & RainHeightInput)
  | ({
      monthlyRainfallMm: readonly number[];
      monthlyTemperatureC: readonly number[];
      /** 'itu-r-maps' when the normals were read from the ITU-R P.837-7 / P.1510-1 maps at the site (the default source). */
      origin?: 'itu-r-maps' | 'user';
    } & RainHeightInput)
  | ({ measuredCurve: readonly MeasuredRainPoint[] } & RainHeightInput)
  | ({ climateZone: ClimateZone } & RainHeightInput);

/** Which source was used; shown on the result and the quote. */
export type ClimateSourceKind = 'itu-r-maps' | 'r001' | 'monthly-normals' | 'measured-curve' | 'climate-zone';

/** The rain climate as used by the study. */
export interface ClimateSource {
  kind: ClimateSourceKind;
  /** Human-readable provenance, e.g. "ITU-R P.837-7 Annex 1 from monthly normals". */
  label: string;
  /** R_0.01 handed to ITU-R P.618-14 (which takes only R_0.01), mm/h. */
  r001MmH: number;
  /** P0 (% of the year with rain), only for monthly normals (ITU-R P.837-7 Annex 1). */
  p0Percent: number | null;
}

/**
 * Resolve the study's rain climate to the R_0.01 that ITU-R P.618-14 §2.2.1.1 step 4 needs,
 * and say where it came from (server/engine/README.md §1): a known R_0.01; P.837-7 Annex 1 from monthly
 * normals (R_0.01 by its step 6 inverse); a measured curve interpolated log-log at 0.01 %
 * (refused if 0.01 % lies outside the measured range — no silent extrapolation); or the
 * P.837-1 zone table's 0.01 % value.
 *
 * Bad input: none or more than one source, or any bad value inside one, throws
 * EngineInputError whose field starts with `rain.` (e.g. `rain.measuredCurve`).
 *
 * @example
 * resolveRainClimate({ climateZone: 'K' })
 * // => { kind: 'climate-zone', label: 'ITU-R P.837-1 rain climate zone K', r001MmH: 42, p0Percent: null }
 */
export function resolveRainClimate(rain: RainClimateInput, prefix = 'rain.'): ClimateSource {
  if (rain === null || typeof rain !== 'object') throw new EngineInputError(prefix.replace(/\.$/, ''), 'a rain climate is required', rain);
  const r = rain as unknown as Record<string, unknown>;
  const given = ['r001MmH', 'monthlyRainfallMm', 'measuredCurve', 'climateZone'].filter((k) => r[k] !== undefined);
  if (given.length !== 1) {
    throw new EngineInputError(
      prefix.replace(/\.$/, ''),
      `give exactly one rain climate source (r001MmH, monthly normals, measuredCurve or climateZone); got ${given.length}`,
      given,
    );
  }
  switch (given[0]) {
    case 'r001MmH': {
      const v = requireNumberInRange(r.r001MmH, `${prefix}r001MmH`, PHYSICAL_RANGES.r001MmH.min, PHYSICAL_RANGES.r001MmH.max, 'physical range');
      return { kind: 'r001', label: `R0.01 given by the user (${round(v)} mm/h)`, r001MmH: v, p0Percent: null };
    }
    case 'monthlyRainfallMm': {
      const climate = withPrefix(prefix, () =>
        monthlyRainClimate({
          monthlyRainfallMm: r.monthlyRainfallMm as number[],
          monthlyTemperatureC: r.monthlyTemperatureC as number[],
        }),
      );
      if (r.origin !== undefined && r.origin !== 'itu-r-maps' && r.origin !== 'user') {
        throw new EngineInputError(`${prefix}origin`, `must be 'itu-r-maps' or 'user'; got ${String(r.origin)}`, r.origin);
      }
      const v = derivedR001(climate.rainRateExceeded(0.01), `${prefix}monthlyRainfallMm`, 'the monthly normals give');
      if (r.origin === 'itu-r-maps') {
        return { kind: 'itu-r-maps', label: "ITU-R P.837-7 Annex 1 from the ITU-R P.837-7 rainfall and P.1510-1 temperature maps at the site's coordinates", r001MmH: v, p0Percent: climate.p0Percent };
      }
      return { kind: 'monthly-normals', label: 'ITU-R P.837-7 Annex 1 from monthly rainfall and temperature normals', r001MmH: v, p0Percent: climate.p0Percent };
    }
    case 'measuredCurve': {
      const curve = measuredRainCurve({ points: r.measuredCurve as MeasuredRainPoint[], field: `${prefix}measuredCurve` });
      if (!curve.covers(0.01)) {
        throw new EngineInputError(
          `${prefix}measuredCurve`,
          `ITU-R P.618-14 needs R0.01; the measured curve covers ${curve.minPPercent}–${curve.maxPPercent} % of the year and is not extrapolated to 0.01 %`,
          r.measuredCurve,
        );
      }
      const v = derivedR001(curve.rainRateAt(0.01), `${prefix}measuredCurve`, 'the measured curve gives');
      return {
        kind: 'measured-curve',
        label: `measured exceedance curve (${curve.points.length} points, ${curve.minPPercent}–${curve.maxPPercent} %), log-log interpolation at 0.01 %`,
        r001MmH: v,
        p0Percent: null,
      };
    }
    default: {
      if (!isClimateZone(r.climateZone)) {
        throw new EngineInputError(`${prefix}climateZone`, `must be an ITU-R P.837-1 zone letter A–H, J–N, P or Q; got ${String(r.climateZone)}`, r.climateZone);
      }
      const v = climateZoneRainRate({ zone: r.climateZone, pPercent: 0.01 });
      return { kind: 'climate-zone', label: `ITU-R P.837-1 rain climate zone ${r.climateZone}`, r001MmH: v, p0Percent: null };
    }
  }
}

/** A derived R0.01 must be physical too: the source is refused, naming it, never passed on. */
function derivedR001(v: number, field: string, what: string): number {
  const max = PHYSICAL_RANGES.r001MmH.max;
  if (!Number.isFinite(v) || v > max) throw new EngineInputError(field, `${what} R0.01 = ${round(v)} mm/h, above the physical range (at most ${max} mm/h); check the figures`, v);
  return v;
}

function round(v: number): string {
  return Number(v.toPrecision(6)).toString();
}

/** Re-throw an inner EngineInputError with the caller's field prefix. */
function withPrefix<T>(prefix: string, run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (e instanceof EngineInputError) throw new EngineInputError(`${prefix}${e.field}`, e.message.replace(`${e.field}: `, ''), e.value);
    throw e;
  }
}
