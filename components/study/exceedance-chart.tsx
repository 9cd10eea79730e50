'use client';

import { Line } from 'react-chartjs-2';
import './chart-setup';
import { CHART, thresholdShade } from './chart-setup';

export type ThresholdMark = { label: string; fadeThresholdDb: number; outagePercent: number };

/**
 * The downlink attenuation-exceedance curve (ITU-R P.618-14 §2.2.1.1 step 10, 0.001–5 % of an
 * average year, log x) with each dish's fade threshold A* as a horizontal line: where a line
 * meets the curve is that dish's outage percentage.
 */
export function ExceedanceChart({ curve, marks, description }: { curve: { pPercent: number; attenuationDb: number }[]; marks: ThresholdMark[]; description: string }) {
  return (
    <figure>
      <div className="relative h-64 sm:h-72">
        <Line
          role="img"
          aria-label={description}
          data={{
            datasets: [
              {
                label: 'Rain attenuation exceeded',
                data: curve.map((p) => ({ x: p.pPercent, y: p.attenuationDb })),
                borderColor: CHART.line,
                borderWidth: 2,
                pointRadius: 0,
                tension: 0.2,
              },
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
              legend: { position: 'bottom', labels: { color: CHART.text, font: CHART.font, boxWidth: 14 } },
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
              y: { type: 'linear', beginAtZero: true, title: { display: true, text: 'Rain attenuation (dB)', color: CHART.text, font: CHART.font }, grid: { color: CHART.grid }, ticks: { color: CHART.text, font: CHART.font } },
            },
          }}
        />
      </div>
      <figcaption className="mt-2 text-xs text-stone-600">{description}</figcaption>
    </figure>
  );
}
