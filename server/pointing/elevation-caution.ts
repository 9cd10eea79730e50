/**
 * The caution for a low look angle. Below 5° the engine itself warns (terrain may block the path,
 * and the atmosphere layers are left out). Between 5° and 10° the figures are computed as usual, but
 * nearby obstructions, a wet antenna and scintillation weigh more than the yearly figures show
 * (common practice, no source), so installers are told to check the horizon on site.
 */
export const LOW_ELEVATION_CAUTION_FROM_DEG = 5;
export const LOW_ELEVATION_CAUTION_BELOW_DEG = 10;

export function lowElevationCaution(elevationDeg: number): { title: string; text: string } | null {
  if (!(elevationDeg >= LOW_ELEVATION_CAUTION_FROM_DEG && elevationDeg < LOW_ELEVATION_CAUTION_BELOW_DEG)) return null;
  return {
    title: 'Low look angle',
    text: `The dish looks up only ${elevationDeg.toFixed(1)}° above the horizon. Between 5° and 10° trees, buildings and terrain in the look direction can block the path, a wet reflector and feed cover cost more signal, and scintillation grows; the outage figures assume a clear view. Check the horizon along the azimuth on site before quoting, and leave extra margin.`,
  };
}
