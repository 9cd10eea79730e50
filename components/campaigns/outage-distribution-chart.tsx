'use client';

import { Bar } from 'react-chartjs-2';
import { axisTicks, axisTitle, baseChartOptions, CHART, chartText, gridLines } from '@/components/charts/chart-setup';
import { ChartFigure } from '@/components/charts/chart-figure';

/** Sites per band of outage minutes a year, now and after the recommended upgrades, side by side. */
export function OutageDistributionChart({ buckets, before, after }: { buckets: string[]; before: number[]; after: number[] }) {
  const describe = `Sites by outage minutes per year. Now: ${buckets.map((b, i) => `${b}: ${before[i]}`).join(', ')}. After the upgrades: ${buckets.map((b, i) => `${b}: ${after[i]}`).join(', ')}.`;
  return (
    <ChartFigure captionGap="mt-1" caption={<>Sites not upgraded keep today&apos;s figure. Long-term averages of an average year (ITU-R P.618), not a guarantee for any one year.</>}>
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
          ...baseChartOptions(),
          plugins: { legend: { labels: chartText() } },
          scales: {
            x: { title: axisTitle('Outage, minutes per year (average year)'), ticks: axisTicks(), grid: { display: false } },
            y: { title: axisTitle('Sites'), ticks: axisTicks({ precision: 0 }), grid: gridLines(), beginAtZero: true },
          },
        }}
      />
    </ChartFigure>
  );
}
