import { useId } from 'react';
import type { ReactNode } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { climatePlaceOf } from '@/server/studies/climate-location';
import { fixed } from './format';
import { LegacyClimateSummary } from './climate-summary-legacy';

/** ITU-R P.839-4 §2: h_R = h_0 + 0.36 km. */
const RAIN_HEIGHT_ABOVE_ISOTHERM_KM = 0.36;
const ZERO_CELSIUS_K = 273.15;
const AT_SITE = 'from the ITU-R maps at the site';
/** The method that turns each kind of rain climate into R0.01. */
const R001_METHOD: Record<string, string> = {
  'itu-r-maps': 'ITU-R P.837-7 Annex 1',
  'monthly-normals': 'ITU-R P.837-7 Annex 1',
  'measured-curve': 'measured curve, log-log interpolation',
  'known-r001': 'given in the profile',
  'climate-zone': 'ITU-R P.837-1 zone table',
};

/** One figure: its name, value with unit, and the Recommendation and where the input came from. */
function Figure({ term, value, method, from }: { term: string; value: ReactNode; method: string; from: string }) {
  return (
    <div className="py-2">
      <dt className="text-stone-600">{term}</dt>
      <dd className="num text-left text-stone-900">{value}</dd>
      <dd className="text-xs text-stone-600">
        {method} · {from}
      </dd>
    </div>
  );
}

/**
 * Where every climate figure of the study comes from: the rain climate (the ITU-R maps at the
 * site, or a company profile as a stated override), the rain height, the station altitude, N_wet,
 * gases and clouds, each with its Recommendation, and the map data version. Studies made before
 * the site's own climate keep their old summary.
 */
export function ClimateSummary({ inputs, result }: { inputs: StudyInputsSnapshot; result: StudyResultSnapshot }) {
  // Unique per use: a study comparing services shows this once per service.
  const uid = useId();
  const maps = inputs.siteMaps;
  if (!maps) return <LegacyClimateSummary inputs={inputs} result={result} />;
  const t = result.tradeoff;
  const c = inputs.climate;
  const onMaps = c.kind === 'itu-r-maps';
  const rainFrom = onMaps ? AT_SITE : `from profile “${c.name}”`;
  const isothermFrom = maps.isothermUsed ? AT_SITE : `from profile “${c.name}”`;
  const h0 = maps.isothermUsed ? maps.isothermHeightKm : (c.zeroIsothermKm ?? t.rainHeightKm - RAIN_HEIGHT_ABOVE_ISOTHERM_KM);
  const altitudeFromMap = inputs.site.altitudeSource === 'itu-r-p1511-1';
  const place = climatePlaceOf(inputs.site, c);
  const atm = t.atmosphere;
  return (
    <section aria-labelledby={`climate-title-${uid}`} className="rounded-md border border-stone-200 bg-white px-4 py-3">
      <h2 id={`climate-title-${uid}`} className="text-sm font-semibold text-stone-900">
        Climate at the site
      </h2>
      <p className="mt-1 text-sm text-stone-800">
        {onMaps ? (
          <>
            Rain climate: <strong>{c.name}</strong>.
          </>
        ) : (
          <>
            Rain climate: profile <strong>“{c.name}”</strong> ({CLIMATE_KIND_LABELS[c.kind]}), an override of the ITU-R maps
            {place?.kind === 'near' ? `, made for a place ${fixed(place.distanceKm, 0)} km from the site` : ''}. Source: {c.sourceNote}.
          </>
        )}{' '}
        Gases, clouds and scintillation always come from the ITU-R maps at the site.
      </p>
      <p className="mt-1 text-xs text-stone-600">Method: {t.climateSource.label}.</p>
      <dl className="mt-2 grid gap-x-6 text-sm sm:grid-cols-2 lg:grid-cols-3">
        <Figure term="Rain rate exceeded 0.01 % of the year (R0.01)" value={`${fixed(t.climateSource.r001MmH, 1)} mm/h`} method={R001_METHOD[c.kind] ?? c.kind} from={rainFrom} />
        {t.climateSource.p0Percent !== null && (
          <Figure term="Share of the year with rain (P0)" value={`${fixed(t.climateSource.p0Percent, 2)} %`} method="ITU-R P.837-7 Annex 1" from={rainFrom} />
        )}
        <Figure term="0 °C isotherm height h0" value={`${fixed(h0, 2)} km`} method="ITU-R P.839-4" from={isothermFrom} />
        <Figure term="Rain height hR" value={`${fixed(t.rainHeightKm, 2)} km`} method="ITU-R P.839-4: h0 + 0.36 km" from={isothermFrom} />
        <Figure
          term="Station altitude"
          value={`${fixed(inputs.site.altitudeM, 0)} m`}
          method="ITU-R P.1511-1"
          from={altitudeFromMap ? AT_SITE : `entered for the site (the map gives ${fixed(maps.topographicHeightKm * 1000, 0)} m)`}
        />
        <Figure term="Wet refractivity N_wet (median)" value={fixed(atm?.nWetMedian ?? maps.nWetMedian, 1)} method="ITU-R P.453-14" from={AT_SITE} />
        {atm && (
          <>
            <Figure term="Gases exceeded 1 % of the year" value={`${fixed(atm.gas1PctDb, 2)} dB`} method={`ITU-R P.676-12 Annex 2 with P.836-6 vapour; ${fixed(atm.pressureHpa, 0)} hPa (P.835)`} from={AT_SITE} />
            <Figure term="Clouds exceeded 1 % of the year" value={`${fixed(atm.cloud1PctDb, 2)} dB`} method="ITU-R P.840-8" from={AT_SITE} />
            <Figure term="Mean surface temperature" value={`${fixed(atm.surfaceTemperatureK - ZERO_CELSIUS_K, 1)} °C`} method="ITU-R P.1510-1" from={AT_SITE} />
          </>
        )}
        <Figure term="Rain attenuation exceeded 0.01 % (A0.01)" value={`${fixed(t.rainAttenuation001Db, 2)} dB`} method="ITU-R P.618-14 §2.2.1.1" from="downlink, this site" />
      </dl>
      <p className="mt-2 border-t border-stone-100 pt-2 text-xs text-stone-600">
        Map data version <span className="font-mono">{maps.mapDataVersion}</span>: {maps.mapVersions.filter((v) => !v.startsWith('maps:')).join(', ')}.
      </p>
    </section>
  );
}
