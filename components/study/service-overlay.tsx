import type { ServiceSection } from '@/server/studies/comparison';
import { allowedMinutesPerYear, minutesText, readStudyOptions } from '@/server/study-option';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { ServiceOverlayCharts, type ServiceSeries } from './service-overlay-chart';

/** The services of a study drawn over each other (figures from the stored snapshots, read through the option read model). */
export function ServiceOverlay({ sections }: { sections: ServiceSection[] }) {
  const series: ServiceSeries[] = sections.map((s) => ({
    name: `${s.inputs.service.name}${s.result.tradeoff.recommendation.basis === 'two-way' ? ' (two-way)' : ''}`,
    outage: readStudyOptions(s.result.tradeoff)
      .filter((r) => r.closes)
      .map((r) => ({ diameterCm: r.diameterM * 100, minutes: r.figures.outageMinutesPerYear, minutesText: r.outage.minutesText })),
    curve: s.result.exceedanceCurve.map((p) => ({ pPercent: p.pPercent, attenuationDb: p.attenuationDb })),
  }));
  const target = allowedMinutesPerYear(sections[0]?.inputs.targetAvailabilityPercent ?? 0);
  const targetText = target === null ? '' : minutesText(target, 'down');
  const outageDescription = `Outage minutes per year against dish diameter, by service: ${series
    .map((s) => `${s.name} ${s.outage.map((p) => `${Math.round(p.diameterCm)} cm ${p.minutesText}`).join(', ') || 'no dish closes the link'}`)
    .join('; ')}${target !== null ? `; the target allows ${targetText}` : ''}.`;
  // The stored curve's point nearest 0.01 % on the log axis (the curves are sampled, not always at 0.01 % itself).
  const near = (s: ServiceSeries) => s.curve.reduce<ServiceSeries['curve'][number] | undefined>((best, c) => (!best || Math.abs(Math.log10(c.pPercent / 0.01)) < Math.abs(Math.log10(best.pPercent / 0.01)) ? c : best), undefined);
  const pointText = (s: ServiceSeries) => {
    const c = near(s);
    return c ? `${c.attenuationDb.toFixed(1)} dB at ${Number(c.pPercent.toPrecision(2))} %` : 'no curve';
  };
  const curveDescription = `Downlink attenuation exceeded for a percentage of an average year (ITU-R P.618-14), by service: ${series
    .map((s) => `${s.name} ${pointText(s)}`)
    .join('; ')}. A higher frequency fades more in the same rain.`;
  return (
    <Card aria-labelledby="service-overlay-title">
      <CardHeader id="service-overlay-title" title="The services side by side" description="Each service's outage against dish size, and its downlink attenuation-exceedance curve, on the same axes." />
      <CardBody>
        <ServiceOverlayCharts series={series} targetMinutes={target} targetText={targetText} outageDescription={outageDescription} curveDescription={curveDescription} />
      </CardBody>
    </Card>
  );
}
