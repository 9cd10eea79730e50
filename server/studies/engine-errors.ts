import { InvalidInputError } from '@/server/errors';
import { isEngineInputError } from '@/server/engine/errors';

/** Which box of the new-study form an engine field belongs to (engine fields are scenario paths). */
function formFieldOf(engineField: string): string {
  if (engineField.startsWith('site.')) return engineField === 'site.altitudeKm' ? 'altitudeM' : engineField.endsWith('lonDeg') ? 'lonDeg' : 'latDeg';
  if (engineField.startsWith('rain')) return 'climateProfileId';
  if (engineField.startsWith('dishes')) return 'dishIds';
  if (engineField.startsWith('targetAvailability')) return 'targetAvailabilityPercent';
  return 'serviceProfileId';
}

const PLAIN: [RegExp, string][] = [
  [/below the horizon/, 'The satellite is below the horizon at this site: no dish can see it. Choose another service or check the coordinates.'],
];

/**
 * The engine refused the study's inputs: a 422 naming the form field, in plain words where we
 * have them (the engine's own message otherwise). Anything else is re-thrown unchanged.
 */
export function toStudyInputError(error: unknown): never {
  if (!isEngineInputError(error)) throw error;
  const plain = PLAIN.find(([re]) => re.test(error.message))?.[1];
  const message = plain ?? `The study cannot be computed: ${error.message}`;
  throw new InvalidInputError(message, { [formFieldOf(error.field)]: [message] });
}
