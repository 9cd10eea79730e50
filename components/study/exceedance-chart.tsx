'use client';

import { baseChartOptions, boxLegendLabels, CHART, exceedanceTooltip, linearAxis, lineLegendLabels, percentOfYearAxis } from '@/components/charts/chart-setup';
import { LineChartFigure } from '@/components/charts/chart-figure';

export type ThresholdMark = { label: string; fadeThresholdDb: number; outagePercent: number };
export type CurvePoint = { pPercent: number; attenuationDb: number; gasDb?: number; cloudDb?: number; rainDb?: number; scintillationDb?: number };

/** The four components drawn under the total: stone shades with their own dash, so the one accent stays the total's. */
const COMPONENTS = [
  { key: 'rainDb', label: 'Rain (P.618-14)', color: '#57534e', dash: [6, 3] },
  { key: 'cloudDb', label: 'Clouds (P.840-8)', color: '#78716c', dash: [10, 3, 2, 3] },
  { key: 'gasDb', label: 'Gases (P.676-12)', color: '#a8a29e', dash: [2, 3] },
  { key: 'scintillationDb', label: 'Scintillation (P.618-14 §2.4.1)', color: '#a8a29e', dash: [12, 4] },
] as const;

/** Stone shades for the per-dish fade-threshold lines, darkest for the largest dish. */
export function thresholdShade(i: number, n: number): string {
  const t = n <= 1 ? 0.5 : i / (n - 1);
  const l = Math.round(70 - t * 45);
  return `hsl(176 35% ${l}%)`;
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
    // The total draws five curves and a legend line each: it gets more height, so the plot is not squeezed.
    <LineChartFigure
      description={description}
      height={total ? 'h-80 sm:h-96' : 'h-64 sm:h-72'}
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
        ...baseChartOptions(),
        parsing: false,
        plugins: {
          legend: {
            position: 'bottom',
            labels: total ? lineLegendLabels((ds) => Math.max(1.5, ds.borderWidth ?? 1.5)) : boxLegendLabels(),
          },
          tooltip: exceedanceTooltip(),
        },
        scales: {
          x: percentOfYearAxis(),
          y: linearAxis(total ? 'Attenuation (dB)' : 'Rain attenuation (dB)', { beginAtZero: true }),
        },
      }}
    />
  );
}
