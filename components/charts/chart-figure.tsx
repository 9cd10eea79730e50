import type { ReactNode } from 'react';

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
