import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { fixed } from './format';

const RAIN_HEIGHT_SOURCE: Record<string, string> = {
  given: 'given with the climate',
  'zero-isotherm': 'ITU-R P.839-4: 0 °C isotherm height + 0.36 km',
  'latitude-approximation': 'approximation: latitude rule of older editions of ITU-R P.839 (no 0 °C isotherm height given)',
};

/**
 * The rain-climate summary of studies made before the site's own climate (no `siteMaps` in the
 * snapshot): kept exactly as those studies were shown, so an old study reads as it did.
 */
export function LegacyClimateSummary({ inputs, result }: { inputs: StudyInputsSnapshot; result: StudyResultSnapshot }) {
  // Unique per use: a study comparing services shows this once per service.
  const uid = useId();
  const t = result.tradeoff;
  const approx = t.rainHeightSource === 'latitude-approximation';
  return (
    <section aria-labelledby={`climate-title-${uid}`} className="rounded-md border border-stone-200 bg-white px-4 py-3">
      <h2 id={`climate-title-${uid}`} className="text-sm font-semibold text-stone-900">
        Rain climate
      </h2>
      <dl className="mt-2 grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-stone-600">Profile</dt>
          <dd className="text-stone-900">
            {inputs.climate.name} · {CLIMATE_KIND_LABELS[inputs.climate.kind]}
          </dd>
        </div>
        <div>
          <dt className="text-stone-600">Source of the figures</dt>
          <dd className="text-stone-900">{inputs.climate.sourceNote}</dd>
        </div>
        <div>
          <dt className="text-stone-600">Method</dt>
          <dd className="text-stone-900">{t.climateSource.label}</dd>
        </div>
        <div>
          <dt className="text-stone-600">Rain rate exceeded 0.01 % of the year (R0.01)</dt>
          <dd className="num text-left text-stone-900">
            {fixed(t.climateSource.r001MmH, 1)} mm/h
            {t.climateSource.p0Percent !== null && <span className="text-stone-600"> · rain {fixed(t.climateSource.p0Percent, 2)} % of the year (P0)</span>}
          </dd>
        </div>
        <div>
          <dt className="text-stone-600">Rain height h_R</dt>
          <dd className="text-stone-900">
            <span className="num">{fixed(t.rainHeightKm, 2)} km</span>{' '}
            <span className={approx ? 'rounded bg-amber-50 px-1 text-amber-900' : 'text-stone-600'}>({RAIN_HEIGHT_SOURCE[t.rainHeightSource] ?? t.rainHeightSource})</span>
          </dd>
        </div>
        <div>
          <dt className="text-stone-600">Rain attenuation exceeded 0.01 % (A0.01, ITU-R P.618-14)</dt>
          <dd className="num text-left text-stone-900">{fixed(t.rainAttenuation001Db, 2)} dB</dd>
        </div>
      </dl>
    </section>
  );
}
