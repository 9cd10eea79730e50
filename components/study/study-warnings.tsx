import type { EngineWarning } from '@/server/engine/tradeoff-types';
import { Notice } from '@/components/ui/notice';
import { lowElevationCaution } from '@/server/pointing/elevation-caution';

// Warnings each dish row already shows in the table are not repeated here.
const SHOWN_IN_TABLE = new Set(['dish-does-not-close', 'uplink-does-not-close']);

/**
 * The engine's warnings for this study (low elevation, rain-height approximation, bounds…), and
 * with `elevationDeg` the 5–10° look-angle caution that the engine leaves to the screens.
 */
export function StudyWarnings({ warnings, elevationDeg }: { warnings: EngineWarning[]; elevationDeg?: number }) {
  const list = warnings.filter((w) => !SHOWN_IN_TABLE.has(w.code));
  const lowLook = elevationDeg === undefined ? null : lowElevationCaution(elevationDeg);
  if (!list.length && !lowLook) return null;
  const low = list.filter((w) => w.code === 'low-elevation');
  const rest = list.filter((w) => w.code !== 'low-elevation');
  return (
    <div className="space-y-3">
      {lowLook && (
        <Notice tone="caution" title={lowLook.title}>
          {lowLook.text}
        </Notice>
      )}
      {low.map((w) => (
        <Notice key={w.code} tone="caution" title="Low elevation">
          {w.message}
        </Notice>
      ))}
      {rest.length > 0 && (
        <Notice tone="info" title="Notes on these figures">
          <ul className="list-disc space-y-1 pl-5">
            {rest.map((w, i) => (
              <li key={`${w.code}-${i}`}>{w.message}</li>
            ))}
          </ul>
        </Notice>
      )}
    </div>
  );
}
