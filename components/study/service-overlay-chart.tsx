'use client';

import { Line } from 'react-chartjs-2';
import { Chart, type Chart as ChartInstance, type LegendItem } from 'chart.js';
import './chart-setup';
import { CHART } from './chart-setup';

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

const font = CHART.font;

/** Legend entries as short lines in each series' own colour and dash, so the legend tells the services apart as the plot does. */
function lineLegendItems(chart: ChartInstance): LegendItem[] {
  return Chart.defaults.plugins.legend.labels.generateLabels(chart).map((item) => {
    const ds = chart.data.datasets[item.datasetIndex ?? 0] as { borderDash?: number[]; borderColor?: string };
    return { ...item, pointStyle: 'line', lineDash: ds.borderDash ?? [], strokeStyle: ds.borderColor, lineWidth: 2 };
  });
}
const axis = (text: string) => ({ display: true, text, color: CHART.text, font });

/** Two overlays for a study comparing services: outage against dish size, and the exceedance curves. */
export function ServiceOverlayCharts({ series, targetMinutes, targetText, outageDescription, curveDescription }: { series: ServiceSeries[]; targetMinutes: number | null; targetText: string; outageDescription: string; curveDescription: string }) {
  const xs = series.flatMap((s) => s.outage.map((p) => p.diameterCm));
  const minX = xs.length ? Math.min(...xs) : 0;
  const maxX = xs.length ? Math.max(...xs) : 100;
  const legend = { position: 'bottom' as const, labels: { color: CHART.text, font, usePointStyle: true, pointStyleWidth: 28, generateLabels: lineLegendItems } };
  return (
    <div className="grid gap-6 lg:grid-cols-2 [&>*]:min-w-0">
      <figure>
        <div className="relative h-64 sm:h-72">
          <Line
            role="img"
            aria-label={outageDescription}
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
              responsive: true,
              maintainAspectRatio: false,
              animation: false,
              parsing: false,
              plugins: {
                legend,
                tooltip: { callbacks: { label: (item) => (item.datasetIndex < series.length ? `${item.dataset.label}: ${series[item.datasetIndex].outage[item.dataIndex]?.minutesText} a year` : `${item.dataset.label}`) } },
              },
              scales: {
                x: { type: 'linear', min: minX - 5, max: maxX + 5, title: axis('Dish diameter (cm)'), grid: { color: CHART.grid }, ticks: { color: CHART.text, font } },
                y: { type: 'linear', beginAtZero: true, title: axis('Outage (minutes per year)'), grid: { color: CHART.grid }, ticks: { color: CHART.text, font } },
              },
            }}
          />
        </div>
        <figcaption className="mt-2 text-xs text-stone-600">{outageDescription}</figcaption>
      </figure>
      <figure>
        <div className="relative h-64 sm:h-72">
          <Line
            role="img"
            aria-label={curveDescription}
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
              responsive: true,
              maintainAspectRatio: false,
              animation: false,
              parsing: false,
              plugins: {
                legend,
                tooltip: { callbacks: { title: (items) => `${items[0]?.parsed.x} % of the year`, label: (item) => `${item.dataset.label}: ${(item.parsed.y ?? 0).toFixed(2)} dB` } },
              },
              scales: {
                x: {
                  type: 'logarithmic',
                  min: 0.001,
                  max: 5,
                  title: axis('Percentage of an average year (log scale)'),
                  grid: { color: CHART.grid },
                  ticks: { color: CHART.text, font, callback: (v) => ([0.001, 0.01, 0.1, 1, 5].includes(Number(v)) ? `${v} %` : '') },
                },
                y: { type: 'linear', beginAtZero: true, title: axis('Downlink attenuation (dB)'), grid: { color: CHART.grid }, ticks: { color: CHART.text, font } },
              },
            }}
          />
        </div>
        <figcaption className="mt-2 text-xs text-stone-600">{curveDescription}</figcaption>
      </figure>
    </div>
  );
}
