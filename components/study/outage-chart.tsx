'use client';

import { baseChartOptions, boxLegendLabels, CHART, linearAxis } from '@/components/charts/chart-setup';
import { LineChartFigure } from '@/components/charts/chart-figure';

/** `minutesText` is the figure as the table writes it (server/study-option), for the tooltip. */
export type OutagePoint = { diameterCm: number; minutes: number; label: string; minutesText: string; bounded: boolean };

/**
 * Outage minutes per year against dish diameter, with the target's allowance as a dashed line.
 * A dish that does not close is left out (it has no outage figure, it never works); the table
 * beside says so.
 */
export function OutageChart({ points, targetMinutes, targetText, description }: { points: OutagePoint[]; targetMinutes: number | null; targetText: string; description: string }) {
  const xs = points.map((p) => p.diameterCm);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  return (
    <LineChartFigure
      description={description}
      data={{
        datasets: [
          {
            label: 'Outage, minutes per year',
            data: points.map((p) => ({ x: p.diameterCm, y: p.minutes })),
            borderColor: CHART.line,
            backgroundColor: CHART.lineSoft,
            pointBackgroundColor: points.map((p) => (p.bounded ? '#ffffff' : CHART.line)),
            pointBorderColor: CHART.line,
            pointRadius: 4,
            fill: true,
            tension: 0.25,
          },
          ...(targetMinutes !== null
            ? [
                {
                  label: 'Allowed by the target',
                  data: [
                    { x: minX, y: targetMinutes },
                    { x: maxX, y: targetMinutes },
                  ],
                  borderColor: CHART.guide,
                  borderDash: [6, 4],
                  borderWidth: 1.5,
                  pointRadius: 0,
                  fill: false,
                },
              ]
            : []),
        ],
      }}
      options={{
        ...baseChartOptions(),
        parsing: false,
        interaction: { mode: 'nearest', intersect: false },
        plugins: {
          legend: { position: 'bottom', labels: boxLegendLabels() },
          tooltip: {
            callbacks: {
              title: (items) => (items[0]?.datasetIndex === 0 ? `${points[items[0].dataIndex]?.label} dish` : ''),
              label: (item) => `${item.dataset.label}: ${item.datasetIndex === 0 ? points[item.dataIndex]?.minutesText : targetText} a year`,
            },
          },
        },
        scales: {
          x: linearAxis('Dish diameter (cm)', { min: minX - 5, max: maxX + 5 }),
          y: linearAxis('Outage (minutes per year)', { beginAtZero: true }),
        },
      }}
    />
  );
}
