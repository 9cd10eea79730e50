import { requireNumberInRange } from './validate';

/** Options of {@link geoLookAngles}. Degrees; longitudes east-positive. */
export interface GeoLookAnglesOptions {
  latDeg: number;
  lonDeg: number;
  /** Site altitude above mean sea level, km. */
  altitudeKm: number;
  /** Orbital longitude of the geostationary satellite, degrees east. */
  satelliteLongitudeDeg: number;
}

/** Pointing of a dish at a geostationary satellite. */
export interface GeoLookAngles {
  /** Elevation above the local horizontal, degrees (negative: satellite below the horizon). */
  elevationDeg: number;
  /** True azimuth, degrees clockwise from true north, 0 ≤ az < 360. */
  azimuthDeg: number;
  /** Slant range site → satellite, km. */
  rangeKm: number;
  /**
   * Polarization skew, degrees in (−90, 90]: the angle from the local vertical to the
   * satellite's vertical polarization plane (parallel to the Earth's axis), positive when the
   * satellite's vertical appears turned clockwise as seen from behind the dish looking at the
   * satellite. Rotate the feed by this angle for linear polarization; 0 at zenith.
   */
  polarizationSkewDeg: number;
}

/** Equatorial Earth radius, km (WGS-84 a; spherical Earth per server/engine/README.md §3). */
export const EARTH_RADIUS_KM_WGS84 = 6378.137;
/** Geostationary orbit radius, km (server/engine/README.md §3). */
export const GEOSTATIONARY_RADIUS_KM = 42164;

const DEG = Math.PI / 180;

/**
 * Geostationary look angles on a spherical Earth (R_E = 6378.137 km, orbit radius 42 164 km;
 * server/engine/README.md §3 — WGS-84 would change elevation by a few hundredths of a degree): the vector
 * from site to satellite resolved in local east-north-up axes gives elevation, true azimuth and
 * slant range; the skew is the signed angle, about the line of sight, between the projections
 * of the local up direction and of the Earth's axis (common geometry, no ITU source).
 *
 * This function reports a negative elevation honestly; the trade-off refuses such a site
 * (satellite below the horizon) and warns below 5°.
 *
 * Bad input: latitude outside −90…90°, longitudes outside −360…360°, altitude outside
 * −1…10 km, or NaN throws EngineInputError naming the field.
 *
 * @example
 * geoLookAngles({ latDeg: 0, lonDeg: 10, altitudeKm: 0, satelliteLongitudeDeg: 10 })
 * // => { elevationDeg: 90, azimuthDeg: 0, rangeKm: 35785.863, polarizationSkewDeg: 0 }
 */
export function geoLookAngles(options: GeoLookAnglesOptions): GeoLookAngles {
  const lat = requireNumberInRange(options.latDeg, 'latDeg', -90, 90);
  const lon = requireNumberInRange(options.lonDeg, 'lonDeg', -360, 360);
  const alt = requireNumberInRange(options.altitudeKm, 'altitudeKm', -1, 10);
  const satLon = requireNumberInRange(options.satelliteLongitudeDeg, 'satelliteLongitudeDeg', -360, 360);
  return geoLookAnglesUnchecked(lat, lon, alt, satLon);
}

/** {@link geoLookAngles} without validation (hot path). */
export function geoLookAnglesUnchecked(latDeg: number, lonDeg: number, altitudeKm: number, satLonDeg: number): GeoLookAngles {
  const phi = latDeg * DEG;
  const dLon = (satLonDeg - lonDeg) * DEG;
  // Work in axes rotated so the site is at longitude 0: x toward (0°, 0°), z along the Earth's axis.
  const r = EARTH_RADIUS_KM_WGS84 + altitudeKm;
  const cosPhi = Math.cos(phi);
  const sinPhi = Math.sin(phi);
  const dx = GEOSTATIONARY_RADIUS_KM * Math.cos(dLon) - r * cosPhi;
  const dy = GEOSTATIONARY_RADIUS_KM * Math.sin(dLon);
  const dz = -r * sinPhi;
  const range = Math.sqrt(dx * dx + dy * dy + dz * dz);
  // Local axes at the site: east (0,1,0), north (−sinφ,0,cosφ), up (cosφ,0,sinφ).
  const east = dy;
  const north = -sinPhi * dx + cosPhi * dz;
  const up = cosPhi * dx + sinPhi * dz;
  const elevationDeg = Math.asin(Math.max(-1, Math.min(1, up / range))) / DEG;
  let azimuthDeg = Math.atan2(east, north) / DEG;
  if (azimuthDeg < 0) azimuthDeg += 360;
  if (azimuthDeg >= 360 || Math.abs(east) + Math.abs(north) < 1e-9 * range) azimuthDeg = 0;
  return { elevationDeg, azimuthDeg, rangeKm: range, polarizationSkewDeg: skewDeg(dx / range, dy / range, dz / range, cosPhi, sinPhi) };
}

/** Signed angle about line of sight s from the projected local up to the projected Earth axis. */
function skewDeg(sx: number, sy: number, sz: number, cosPhi: number, sinPhi: number): number {
  // u' = u − (u·s)s with u = (cosφ, 0, sinφ); z' = z − (z·s)s with z = (0, 0, 1).
  const us = cosPhi * sx + sinPhi * sz;
  const ux = cosPhi - us * sx;
  const uy = -us * sy;
  const uz = sinPhi - us * sz;
  const zx = -sz * sx;
  const zy = -sz * sy;
  const zz = 1 - sz * sz;
  const uNorm = Math.sqrt(ux * ux + uy * uy + uz * uz);
  if (uNorm < 1e-12) return 0; // satellite at zenith: no defined reference, call it 0
  // sin part: (u' × z')·s ; cos part: u'·z'.
  const cx = uy * zz - uz * zy;
  const cy = uz * zx - ux * zz;
  const cz = ux * zy - uy * zx;
  const sinPart = cx * sx + cy * sy + cz * sz;
  const cosPart = ux * zx + uy * zy + uz * zz;
  let deg = Math.atan2(sinPart, cosPart) / DEG;
  // A polarization plane is the same after a half turn: fold into (−90, 90].
  if (deg > 90) deg -= 180;
  else if (deg <= -90) deg += 180;
  return deg;
}
