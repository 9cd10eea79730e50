'use client';

import type { ReactNode } from 'react';
import type { ChartData, ChartOptions } from 'chart.js';
import { Line } from 'react-chartjs-2';

/**
 * A chart in its figure: a box of fixed height the canvas fills (chart.js `maintainAspectRatio:
 * false`), the caption below. `height` is Tailwind height classes; `captionGap` the caption's top margin.
 */
export function ChartFigure({ children, caption, height = 'h-64 sm:h-72', captionGap = 'mt-2' }: { children: ReactNode; caption: ReactNode; height?: string; captionGap?: string }) {
  return (
    <figure>
      <div className={`relative ${height}`}>{children}</div>
      <figcaption className={`${captionGap} text-xs text-stone-600`}>{caption}</figcaption>
    </figure>
  );
}

/** A line chart whose description is both its caption and what a screen reader reads for the image. */
export function LineChartFigure({ description, data, options, height }: { description: string; data: ChartData<'line'>; options: ChartOptions<'line'>; height?: string }) {
  return (
    <ChartFigure caption={description} height={height}>
      <Line role="img" aria-label={description} data={data} options={options} />
    </ChartFigure>
  );
}
