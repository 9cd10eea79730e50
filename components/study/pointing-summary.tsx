import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { formatDms } from '@/server/validation/coordinates';
import { declinationWords, studyPointing } from '@/server/pointing/magnetic-declination';
import { dateFmt, degrees, fixed, orbitalSlot } from './format';
import { SkyCompass } from './sky-compass';

function Row({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="flex items-baseline justify-between gap-3 py-1.5">
      <dt className="text-sm text-stone-600">{term}</dt>
      <dd className="num text-sm text-stone-900">{children}</dd>
    </div>
  );
}

/** Where to point the dish (geostationary look angles) and what it receives. */
export function PointingSummary({ inputs, result }: { inputs: StudyInputsSnapshot; result: StudyResultSnapshot }) {
  // Unique per use: a study comparing services shows this once per service.
  const uid = useId();
  const t = result.tradeoff;
  const s = inputs.service;
  const linear = s.polarization !== 'circular';
  // Declination for the day the study was computed, so the record reads the same every time it is opened.
  const pointing = studyPointing(inputs.site, t, new Date(result.computedAt));
  const d = pointing.declination;
  return (
    <div className="grid gap-4 md:grid-cols-3">
      <section aria-labelledby={`pointing-title-${uid}`} className="rounded-md border border-stone-200 bg-white px-4 py-3">
        <h2 id={`pointing-title-${uid}`} className="text-sm font-semibold text-stone-900">
          Pointing
        </h2>
        <dl className="mt-1 divide-y divide-stone-100">
          <Row term="Azimuth (true)">{degrees(t.azimuthDeg, 1)}</Row>
          <Row term="Azimuth (magnetic, for a compass)">{degrees(pointing.magneticAzimuthDeg, 1)}</Row>
          <Row term="Elevation">{degrees(t.elevationDeg, 1)}</Row>
          <Row term="Polarization skew">{linear ? `${t.polarizationSkewDeg >= 0 ? '+' : '−'}${fixed(Math.abs(t.polarizationSkewDeg), 1)}°` : 'none (circular)'}</Row>
          <Row term="Slant range">{fixed(t.rangeKm, 0)} km</Row>
        </dl>
        <p className="mt-2 text-xs text-stone-600">
          Magnetic declination {declinationWords(d.declinationDeg)} at the site on {dateFmt.format(d.evaluatedFor)}
          {d.dateHeld ? ' (the nearest date the model covers)' : ''}, from the {d.modelName}, epoch {d.modelEpoch.toFixed(1)}. Compass readings also shift near steel, cars and power lines.
        </p>
        {linear && <p className="mt-2 text-xs text-stone-600">Skew: turn the feed clockwise by a positive angle, seen from behind the dish looking at the satellite.</p>}
        <div className="mt-3">
          <SkyCompass trueAzimuthDeg={t.azimuthDeg} magneticAzimuthDeg={pointing.magneticAzimuthDeg} declinationDeg={d.declinationDeg} elevationDeg={t.elevationDeg} />
        </div>
      </section>
      <section aria-labelledby={`site-title-${uid}`} className="rounded-md border border-stone-200 bg-white px-4 py-3">
        <h2 id={`site-title-${uid}`} className="text-sm font-semibold text-stone-900">
          Site
        </h2>
        <dl className="mt-1 divide-y divide-stone-100">
          <Row term="Latitude">{formatDms(inputs.site.latDeg, 'lat')}</Row>
          <Row term="Longitude">{formatDms(inputs.site.lonDeg, 'lon')}</Row>
          <Row term="Decimal">{`${fixed(inputs.site.latDeg, 5)}, ${fixed(inputs.site.lonDeg, 5)}`}</Row>
          <Row term="Altitude">
            {fixed(inputs.site.altitudeM, 0)} m
            {/* Older studies recorded no source: they show the figure alone, as they always did. */}
            {inputs.site.altitudeSource && (
              <span className="block text-right font-sans text-xs text-stone-600">{inputs.site.altitudeSource === 'user' ? 'entered for the site' : 'ITU-R P.1511-1 map at the site'}</span>
            )}
          </Row>
        </dl>
      </section>
      <section aria-labelledby={`carrier-title-${uid}`} className="rounded-md border border-stone-200 bg-white px-4 py-3">
        <h2 id={`carrier-title-${uid}`} className="text-sm font-semibold text-stone-900">
          Carrier
        </h2>
        <dl className="mt-1 divide-y divide-stone-100">
          <Row term="Satellite">
            <span className="font-sans">{s.satelliteName}</span> · {orbitalSlot(s.satelliteLongitudeDeg)}
          </Row>
          <Row term="Downlink">
            {fixed(s.downlinkFrequencyGHz, 3)} GHz · {s.polarization === 'circular' ? 'circular' : s.polarization === 'linear-vertical' ? 'linear V' : 'linear H'}
          </Row>
          <Row term="EIRP · symbol rate">
            {fixed(s.eirpDbw, 1)} dBW · {fixed(s.symbolRateMsps, 1)} Msps
          </Row>
          <Row term="Required Es/N0">
            {s.modcod ? `${s.modcod} · ` : ''}
            {fixed(s.requiredEsN0Db, 2)} dB + {fixed(s.implementationMarginDb, 1)} dB margin
          </Row>
          {s.uplink && (
            <Row term="Uplink">
              {fixed(s.uplink.frequencyGHz, 3)} GHz · {s.uplink.hpaPowerW !== undefined ? `${fixed(s.uplink.hpaPowerW, 1)} W HPA` : `${fixed(s.uplink.terminalEirpDbw ?? 0, 1)} dBW`}
            </Row>
          )}
        </dl>
      </section>
    </div>
  );
}
