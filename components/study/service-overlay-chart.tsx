'use client';

import { baseChartOptions, CHART, exceedanceTooltip, linearAxis, lineLegendLabels, percentOfYearAxis } from '@/components/charts/chart-setup';
import { LineChartFigure } from '@/components/charts/chart-figure';

export type ServiceSeries = {
  name: string;
  /** Outage per dish on the service's own basis; dishes that do not close are left out. */
  outage: { diameterCm: number; minutes: number; minutesText: string }[];
  /** The service's downlink attenuation-exceedance curve (total or rain, as the study stored it). */
  curve: { pPercent: number; attenuationDb: number }[];
};

/** The accent for the first service, stone shades for the others; each service also has its own dash, so print and colour-blind readers can tell them apart. */
const STYLES = [
  { color: CHART.line, dash: [] as number[] },
  { color: '#57534e', dash: [7, 4] },
  { color: '#78716c', dash: [2, 3] },
  { color: '#a8a29e', dash: [12, 4, 2, 4] },
];

/** Legend entries as short lines in each series' own colour and dash, so the legend tells the services apart as the plot does. */
const legend = () => ({ position: 'bottom' as const, labels: lineLegendLabels(() => 2) });

/** Two overlays for a study comparing services: outage against dish size, and the exceedance curves. */
export function ServiceOverlayCharts({ series, targetMinutes, targetText, outageDescription, curveDescription }: { series: ServiceSeries[]; targetMinutes: number | null; targetText: string; outageDescription: string; curveDescription: string }) {
  const xs = series.flatMap((s) => s.outage.map((p) => p.diameterCm));
  const minX = xs.length ? Math.min(...xs) : 0;
  const maxX = xs.length ? Math.max(...xs) : 100;
  return (
    <div className="grid gap-6 lg:grid-cols-2 [&>*]:min-w-0">
      <LineChartFigure
        description={outageDescription}
        data={{
          datasets: [
            ...series.map((s, i) => ({
              label: s.name,
              data: s.outage.map((p) => ({ x: p.diameterCm, y: p.minutes })),
              borderColor: STYLES[i % STYLES.length].color,
              backgroundColor: STYLES[i % STYLES.length].color,
              borderDash: STYLES[i % STYLES.length].dash,
              borderWidth: 2,
              pointRadius: 3,
              tension: 0.25,
            })),
            ...(targetMinutes !== null
              ? [{ label: `Allowed by the target (${targetText})`, data: [{ x: minX, y: targetMinutes }, { x: maxX, y: targetMinutes }], borderColor: CHART.guide, borderDash: [3, 3], borderWidth: 1, pointRadius: 0 }]
              : []),
          ],
        }}
        options={{
          ...baseChartOptions(),
          parsing: false,
          plugins: {
            legend: legend(),
            tooltip: { callbacks: { label: (item) => (item.datasetIndex < series.length ? `${item.dataset.label}: ${series[item.datasetIndex].outage[item.dataIndex]?.minutesText} a year` : `${item.dataset.label}`) } },
          },
          scales: {
            x: linearAxis('Dish diameter (cm)', { min: minX - 5, max: maxX + 5 }),
            y: linearAxis('Outage (minutes per year)', { beginAtZero: true }),
          },
        }}
      />
      <LineChartFigure
        description={curveDescription}
        data={{
          datasets: series.map((s, i) => ({
            label: s.name,
            data: s.curve.map((p) => ({ x: p.pPercent, y: p.attenuationDb })),
            borderColor: STYLES[i % STYLES.length].color,
            borderDash: STYLES[i % STYLES.length].dash,
            borderWidth: 2,
            pointRadius: 0,
            tension: 0.2,
          })),
        }}
        options={{
          ...baseChartOptions(),
          parsing: false,
          plugins: { legend: legend(), tooltip: exceedanceTooltip() },
          scales: {
            x: percentOfYearAxis(),
            y: linearAxis('Downlink attenuation (dB)', { beginAtZero: true }),
          },
        }}
      />
    </div>
  );
}
