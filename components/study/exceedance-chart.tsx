'use client';

import { Line } from 'react-chartjs-2';
import { Chart, type Chart as ChartInstance, type LegendItem } from 'chart.js';
import './chart-setup';
import { CHART, thresholdShade } from './chart-setup';

export type ThresholdMark = { label: string; fadeThresholdDb: number; outagePercent: number };
export type CurvePoint = { pPercent: number; attenuationDb: number; gasDb?: number; cloudDb?: number; rainDb?: number; scintillationDb?: number };

/** The four components drawn under the total: stone shades with their own dash, so the one accent stays the total's. */
const COMPONENTS = [
  { key: 'rainDb', label: 'Rain (P.618-14)', color: '#57534e', dash: [6, 3] },
  { key: 'cloudDb', label: 'Clouds (P.840-8)', color: '#78716c', dash: [10, 3, 2, 3] },
  { key: 'gasDb', label: 'Gases (P.676-12)', color: '#a8a29e', dash: [2, 3] },
  { key: 'scintillationDb', label: 'Scintillation (P.618-14 §2.4.1)', color: '#a8a29e', dash: [12, 4] },
] as const;

/**
 * Legend entries drawn as short lines in each curve's own colour and dash (the default boxes lose
 * the dash, and five dashed grey boxes cannot be told apart).
 */
function lineLegendItems(chart: ChartInstance): LegendItem[] {
  return Chart.defaults.plugins.legend.labels.generateLabels(chart).map((item) => {
    const ds = chart.data.datasets[item.datasetIndex ?? 0] as { borderDash?: number[]; borderColor?: string; borderWidth?: number };
    return { ...item, pointStyle: 'line', lineDash: ds.borderDash ?? [], strokeStyle: ds.borderColor, lineWidth: Math.max(1.5, ds.borderWidth ?? 1.5) };
  });
}

/**
 * The downlink attenuation-exceedance curve (0.001–5 % of an average year, log x) with each
 * dish's fade threshold A* as a horizontal line: where a line meets the curve is that dish's
 * outage percentage. Total studies draw the ITU-R P.618-14 §2.5 total with its four components;
 * older snapshots (points without components) draw rain alone (§2.2.1.1 step 10), as before.
 */
export function ExceedanceChart({ curve, marks, description }: { curve: CurvePoint[]; marks: ThresholdMark[]; description: string }) {
  const total = curve.length > 0 && curve.every((p) => p.rainDb !== undefined);
  const parts = total
    ? COMPONENTS.map((c) => ({
        label: c.label,
        data: curve.map((p) => ({ x: p.pPercent, y: p[c.key] ?? 0 })),
        borderColor: c.color,
        borderDash: [...c.dash],
        borderWidth: 1.25,
        pointRadius: 0,
        tension: 0.2,
      }))
    : [];
  return (
    <figure>
      {/* The total draws five curves and a legend line each: it gets more height, so the plot is not squeezed. */}
      <div className={`relative ${total ? 'h-80 sm:h-96' : 'h-64 sm:h-72'}`}>
        <Line
          role="img"
          aria-label={description}
          data={{
            datasets: [
              {
                label: total ? 'Total attenuation exceeded' : 'Rain attenuation exceeded',
                data: curve.map((p) => ({ x: p.pPercent, y: p.attenuationDb })),
                borderColor: CHART.line,
                borderWidth: total ? 2.5 : 2,
                pointRadius: 0,
                tension: 0.2,
              },
              ...parts,
              ...marks.map((m, i) => ({
                label: `${m.label}: A* ${m.fadeThresholdDb.toFixed(1)} dB`,
                data: [
                  { x: 0.001, y: m.fadeThresholdDb },
                  { x: Math.min(5, Math.max(0.001, m.outagePercent)), y: m.fadeThresholdDb },
                ],
                borderColor: thresholdShade(i, marks.length),
                borderDash: [5, 3],
                borderWidth: 1.5,
                pointRadius: [0, 4],
                pointBackgroundColor: thresholdShade(i, marks.length),
              })),
            ],
          }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            parsing: false,
            plugins: {
              legend: {
                position: 'bottom',
                labels: total
                  ? { color: CHART.text, font: CHART.font, usePointStyle: true, pointStyleWidth: 28, generateLabels: lineLegendItems }
                  : { color: CHART.text, font: CHART.font, boxWidth: 14 },
              },
              tooltip: {
                callbacks: {
                  title: (items) => `${items[0]?.parsed.x} % of the year`,
                  label: (item) => `${item.dataset.label}: ${(item.parsed.y ?? 0).toFixed(2)} dB`,
                },
              },
            },
            scales: {
              x: {
                type: 'logarithmic',
                min: 0.001,
                max: 5,
                title: { display: true, text: 'Percentage of an average year (log scale)', color: CHART.text, font: CHART.font },
                grid: { color: CHART.grid },
                ticks: {
                  color: CHART.text,
                  font: CHART.font,
                  callback: (v) => ([0.001, 0.01, 0.1, 1, 5].includes(Number(v)) ? `${v} %` : ''),
                },
              },
              y: { type: 'linear', beginAtZero: true, title: { display: true, text: total ? 'Attenuation (dB)' : 'Rain attenuation (dB)', color: CHART.text, font: CHART.font }, grid: { color: CHART.grid }, ticks: { color: CHART.text, font: CHART.font } },
            },
          }}
        />
      </div>
      <figcaption className="mt-2 text-xs text-stone-600">{description}</figcaption>
    </figure>
  );
}
