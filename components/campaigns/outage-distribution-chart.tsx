'use client';

import { BarElement, CategoryScale, Chart, Legend, LinearScale, Tooltip } from 'chart.js';
import { Bar } from 'react-chartjs-2';
import { CHART } from '@/components/study/chart-setup';

Chart.register(BarElement, CategoryScale, LinearScale, Tooltip, Legend);

/** Sites per band of outage minutes a year, now and after the recommended upgrades, side by side. */
export function OutageDistributionChart({ buckets, before, after }: { buckets: string[]; before: number[]; after: number[] }) {
  const describe = `Sites by outage minutes per year. Now: ${buckets.map((b, i) => `${b}: ${before[i]}`).join(', ')}. After the upgrades: ${buckets.map((b, i) => `${b}: ${after[i]}`).join(', ')}.`;
  return (
    <figure>
      <div className="relative h-64 sm:h-72">
        <Bar
          role="img"
          aria-label={describe}
          data={{
            labels: buckets,
            datasets: [
              { label: 'Now', data: before, backgroundColor: '#a8a29e' },
              { label: 'After the recommended upgrades', data: after, backgroundColor: CHART.line },
            ],
          }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            plugins: { legend: { labels: { color: CHART.text, font: CHART.font } } },
            scales: {
              x: { title: { display: true, text: 'Outage, minutes per year (average year)', color: CHART.text, font: CHART.font }, ticks: { color: CHART.text, font: CHART.font }, grid: { display: false } },
              y: { title: { display: true, text: 'Sites', color: CHART.text, font: CHART.font }, ticks: { color: CHART.text, font: CHART.font, precision: 0 }, grid: { color: CHART.grid }, beginAtZero: true },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-stone-600">Sites not upgraded keep today&apos;s figure. Long-term averages of an average year (ITU-R P.618), not a guarantee for any one year.</figcaption>
    </figure>
  );
}
