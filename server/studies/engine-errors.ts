import { InvalidInputError } from '@/server/errors';
import { isEngineInputError } from '@/server/engine/errors';

/**
 * Which box of the new-study form an engine field belongs to (engine fields are scenario paths).
 * Site fields (and the site's atmosphere, read from the maps at its coordinates) go to the
 * coordinate boxes when the site was typed in, else to the site picker, which is then the only
 * site box on the form.
 */
function formFieldOf(engineField: string, siteTypedIn: boolean): string {
  if (engineField.startsWith('site.') || engineField.startsWith('atmosphere')) {
    if (!siteTypedIn) return 'siteId';
    return engineField === 'site.altitudeKm' ? 'altitudeM' : engineField.endsWith('lonDeg') ? 'lonDeg' : 'latDeg';
  }
  if (engineField.startsWith('rain')) return 'climateProfileId';
  if (engineField.startsWith('dishes')) return 'dishIds';
  if (engineField.startsWith('targetAvailability')) return 'targetAvailabilityPercent';
  return 'serviceProfileId';
}

const PLAIN: [RegExp, (message: string) => string][] = [
  [/below the horizon/, () => 'The satellite is below the horizon at this site: no dish can see it. Choose another service or check the coordinates.'],
  [
    /no ITU-R map data/,
    (m) => {
      const lat = /latitude (-?[\d.]+)°/.exec(m)?.[1];
      return `The ITU-R maps have no climate data at this site${lat ? ` (latitude ${lat}°)` : ''}, so its rain, gases and clouds cannot be read: check the coordinates. Geostationary satellites cannot be seen this close to the pole anyway.`;
    },
  ],
];

/**
 * The engine (or the maps reader) refused the study's inputs: a 422 naming the form field, in
 * plain words where we have them (the engine's own message otherwise). Anything else is re-thrown
 * unchanged. `siteTypedIn`: the site's coordinates are boxes on the form (a new site), not a pick.
 */
export function toStudyInputError(error: unknown, o: { siteTypedIn?: boolean } = {}): never {
  if (!isEngineInputError(error)) throw error;
  const plain = PLAIN.find(([re]) => re.test(error.message))?.[1](error.message);
  const message = plain ?? `The study cannot be computed: ${error.message}`;
  throw new InvalidInputError(message, { [formFieldOf(error.field, o.siteTypedIn ?? true)]: [message] });
}
