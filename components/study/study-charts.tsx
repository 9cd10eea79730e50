import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { OutageChart } from './outage-chart';
import { ExceedanceChart } from './exceedance-chart';
import { allowedMinutesPerYear, dishName, minutesText, readStudyOptions } from '@/server/study-option';

/** The two charts of the study, fed from the stored snapshot (no computation in the browser). */
export function StudyCharts({ inputs, result }: { inputs: StudyInputsSnapshot; result: StudyResultSnapshot }) {
  // Unique per use: a study comparing services shows this once per service.
  const uid = useId();
  const t = result.tradeoff;
  const rec = t.recommendation;
  const points = readStudyOptions(t)
    .filter((r) => r.closes)
    .map((r) => ({ diameterCm: r.diameterM * 100, minutes: r.figures.outageMinutesPerYear, label: r.diameter.cm, minutesText: r.outage.minutesText, bounded: r.figures.outageBound !== 'none' }));
  const target = allowedMinutesPerYear(rec.targetAvailabilityPercent);
  const marks = t.options
    .map((o, i) => ({ o, i }))
    .filter(({ o }) => o.closes && o.fadeThresholdDb !== null)
    .map(({ o, i }) => ({ label: dishName(inputs.dishes[i]?.name, o.diameterM), fadeThresholdDb: o.fadeThresholdDb as number, outagePercent: o.outagePercent }));
  // The allowance is good news for the dish: it rounds down, never more than the target grants.
  const outageDescription = points.length
    ? `Outage minutes per year against dish diameter: ${points.map((p) => `${p.label} ${p.minutesText}`).join(', ')}${target !== null ? `; the target allows ${minutesText(target, 'down')}` : ''}.`
    : 'No dish of this study closes the link, so there is no outage curve to draw.';
  const curve = result.exceedanceCurve;
  const first = curve[0];
  const last = curve[curve.length - 1];
  // Total curves are drawn for one dish (scintillation depends on its aperture): name it.
  const curveIndex = result.exceedanceCurveOptionIndex;
  const curveDish = curveIndex === undefined ? null : dishName(inputs.dishes[curveIndex]?.name, t.options[curveIndex].diameterM);
  const curveDescription =
    curveDish === null
      ? `Downlink rain attenuation exceeded for a percentage of an average year (ITU-R P.618-14), from ${first?.attenuationDb.toFixed(1)} dB at 0.001 % to ${last?.attenuationDb.toFixed(2)} dB at 5 %, with each dish's fade threshold marked.`
      : `Downlink total attenuation exceeded for a percentage of an average year (ITU-R P.618-14 §2.5, for the ${curveDish}), from ${first?.attenuationDb.toFixed(1)} dB at 0.001 % to ${last?.attenuationDb.toFixed(2)} dB at 5 %, drawn with its parts: rain ${first?.rainDb?.toFixed(1)} dB, clouds ${first?.cloudDb?.toFixed(2)} dB, gases ${first?.gasDb?.toFixed(2)} dB and scintillation ${first?.scintillationDb?.toFixed(2)} dB at 0.001 %; each dish's fade threshold is marked (other dishes differ from this curve only by their scintillation).`;
  // min-w-0: a grid cell never shrinks below its canvas otherwise, so charts drawn wide would stay wide after a resize.
  return (
    <div className="grid gap-6 lg:grid-cols-2 [&>*]:min-w-0">
      <Card aria-labelledby={`outage-chart-title-${uid}`}>
        <CardHeader id={`outage-chart-title-${uid}`} title="Outage against dish size" description={rec.basis === 'two-way' ? 'Two-way outage (upper bound), minutes per year.' : 'Downlink outage, minutes per year.'} />
        <CardBody>{points.length ? <OutageChart points={points} targetMinutes={target} targetText={target === null ? '' : minutesText(target, 'down')} description={outageDescription} /> : <p className="text-sm text-stone-600">{outageDescription}</p>}</CardBody>
      </Card>
      <Card aria-labelledby={`exceedance-chart-title-${uid}`}>
        <CardHeader
          id={`exceedance-chart-title-${uid}`}
          title="Attenuation exceedance"
          description={
            curveDish === null
              ? 'Rain attenuation exceeded against the percentage of the year, with each dish’s fade threshold A*.'
              : 'Total attenuation and its four causes against the percentage of the year, with each dish’s fade threshold A*.'
          }
        />
        <CardBody>
          <ExceedanceChart curve={curve} marks={marks} description={curveDescription} />
        </CardBody>
      </Card>
    </div>
  );
}
