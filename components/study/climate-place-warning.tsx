import type { StudyInputsSnapshot } from '@/server/studies/snapshot';
import { climatePlaceOf, climatePlaceWarning } from '@/server/studies/climate-location';
import { Notice } from '@/components/ui/notice';

/**
 * The study's override rain-climate profile was made more than 100 km from the site (distance
 * stated), or for an unknown place: said at the top of the study, where it cannot be missed.
 */
export function ClimatePlaceWarning({ inputs }: { inputs: Pick<StudyInputsSnapshot, 'site' | 'climate'> }) {
  const place = climatePlaceOf(inputs.site, inputs.climate);
  const text = climatePlaceWarning(inputs.climate.name, place);
  if (!text || !place) return null;
  return (
    <Notice tone="caution" title={place.kind === 'far' ? 'Rain climate made for somewhere else' : 'Rain climate made for an unknown place'}>
      {text}
    </Notice>
  );
}
