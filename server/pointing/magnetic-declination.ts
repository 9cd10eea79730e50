import { model as wmmModel } from 'geomagnetism';

/**
 * Magnetic declination at a site from the World Magnetic Model 2025 (NOAA NCEI / BGS), through the
 * `geomagnetism` package, which ships the model's published coefficients (data/wmm-2025.json).
 * Pure: no I/O beyond the package's bundled coefficients; runs in pages, route handlers and tests.
 */

export const MAGNETIC_MODEL_NAME = 'World Magnetic Model 2025 (WMM2025)';
export const MAGNETIC_MODEL_EPOCH = 2025.0;
// The model's own validity window, as its coefficient file states it (start_date / end_date).
const VALID_FROM = Date.UTC(2024, 10, 13, 3);
const VALID_UNTIL = Date.UTC(2029, 10, 13, 3);

export interface MagneticDeclination {
  /** Declination in degrees, positive when magnetic north lies east of true north. */
  declinationDeg: number;
  /** The date the model was evaluated for (the requested date, held inside the model's validity). */
  evaluatedFor: Date;
  /** True when the requested date lay outside 2024-11-13 … 2029-11-13 and the nearest valid date was used. */
  dateHeld: boolean;
  modelName: string;
  modelEpoch: number;
}

/**
 * Declination at (latDeg, lonDeg, altitudeM above the WGS-84 ellipsoid, which the site's
 * height above sea level stands in for: the difference moves declination by far less than 0.01°).
 * A study made outside the model's five years is evaluated at the nearest valid date and says so,
 * rather than extrapolating the secular variation beyond what the model publishes.
 */
export function magneticDeclination(latDeg: number, lonDeg: number, altitudeM: number, at: Date): MagneticDeclination {
  if (![latDeg, lonDeg, altitudeM, at.getTime()].every(Number.isFinite)) throw new RangeError('magneticDeclination: latitude, longitude, altitude and date must be finite');
  if (Math.abs(latDeg) > 90) throw new RangeError(`magneticDeclination: latitude ${latDeg}° is outside −90…90°`);
  const t = Math.min(Math.max(at.getTime(), VALID_FROM), VALID_UNTIL);
  const evaluatedFor = new Date(t);
  const model = wmmModel(evaluatedFor);
  if (model.epoch !== MAGNETIC_MODEL_EPOCH) throw new Error(`magneticDeclination: expected the WMM2025 coefficients, the package chose ${model.name}`);
  const point = model.point([latDeg, lonDeg, altitudeM / 1000]);
  if (!Number.isFinite(point.decl)) throw new Error('magneticDeclination: the model gave no finite declination');
  return { declinationDeg: point.decl, evaluatedFor, dateHeld: t !== at.getTime(), modelName: MAGNETIC_MODEL_NAME, modelEpoch: MAGNETIC_MODEL_EPOCH };
}

/** Compass bearing from a true bearing: magnetic = true − declination (east declination is positive), in [0, 360). */
export function magneticAzimuthDeg(trueAzimuthDeg: number, declinationDeg: number): number {
  const m = (trueAzimuthDeg - declinationDeg) % 360;
  return m < 0 ? m + 360 : m;
}

/** "4.2° E" / "12.9° W": how compasses and charts write declination. */
export function declinationWords(declinationDeg: number, digits = 1): string {
  const rounded = Number(Math.abs(declinationDeg).toFixed(digits));
  if (rounded === 0) return `0.${'0'.repeat(digits)}°`;
  return `${rounded.toFixed(digits)}° ${declinationDeg > 0 ? 'E' : 'W'}`;
}

/** The pointing figures a study shows: true and magnetic azimuth and the model behind the difference. */
export interface StudyPointing {
  trueAzimuthDeg: number;
  magneticAzimuthDeg: number;
  elevationDeg: number;
  declination: MagneticDeclination;
}

export function studyPointing(site: { latDeg: number; lonDeg: number; altitudeM: number }, look: { azimuthDeg: number; elevationDeg: number }, at: Date): StudyPointing {
  const declination = magneticDeclination(site.latDeg, site.lonDeg, site.altitudeM, at);
  return { trueAzimuthDeg: look.azimuthDeg, magneticAzimuthDeg: magneticAzimuthDeg(look.azimuthDeg, declination.declinationDeg), elevationDeg: look.elevationDeg, declination };
}
