'use client';

import { BarElement, CategoryScale, Chart, Filler, Legend, LinearScale, LineElement, LogarithmicScale, PointElement, Tooltip, type Chart as ChartInstance, type LegendItem, type TooltipItem } from 'chart.js';

// Register only what our charts draw (tree-shaken chart.js): the study's line charts and the campaign's bars.
Chart.register(LinearScale, LogarithmicScale, CategoryScale, PointElement, LineElement, BarElement, Tooltip, Legend, Filler);

/** Chart colours: the ledger teal for data, stone for guides; one accent only (product.md). */
export const CHART = {
  line: '#1f6f69',
  lineSoft: 'rgba(31, 111, 105, 0.12)',
  guide: '#78716c',
  grid: '#e7e5e4',
  text: '#44403c',
  font: { family: 'var(--font-ui), system-ui, sans-serif', size: 12 },
} as const;

/** What every chart of ours shares: it fills its box and is drawn at once (no animation). */
export const baseChartOptions = () => ({ responsive: true, maintainAspectRatio: false, animation: false as const });

/** Our text colour and font, for titles, ticks and legends (fresh objects for each chart). */
export const chartText = () => ({ color: CHART.text, font: { ...CHART.font } });

/** An axis title in our text style. */
export const axisTitle = (text: string) => ({ display: true, ...chartText(), text });

/** Tick labels in our text style; `extra` adds e.g. precision or a label callback. */
export const axisTicks = <T extends object>(extra?: T) => ({ ...chartText(), ...extra }) as ReturnType<typeof chartText> & T;

/** Stone grid lines. */
export const gridLines = () => ({ color: CHART.grid });

/** A linear axis with its title, our ticks and grid; `min`/`max`/`beginAtZero` as the chart needs. */
export function linearAxis(title: string, range: { min?: number; max?: number; beginAtZero?: boolean } = {}) {
  return { type: 'linear' as const, ...range, title: axisTitle(title), grid: gridLines(), ticks: axisTicks() };
}

/** Percentages of an average year on a log axis over the P.618-14 range (0.001–5 %), ticks at the decades and 5 %. */
export function percentOfYearAxis(title = 'Percentage of an average year (log scale)') {
  return {
    type: 'logarithmic' as const,
    min: 0.001,
    max: 5,
    title: axisTitle(title),
    grid: gridLines(),
    ticks: axisTicks({ callback: (v: string | number) => ([0.001, 0.01, 0.1, 1, 5].includes(Number(v)) ? `${v} %` : '') }),
  };
}

/** Legend labels drawn as small boxes in our text style. */
export const boxLegendLabels = () => ({ ...chartText(), boxWidth: 14 });

/**
 * Legend labels drawn as short lines in each dataset's own colour and dash (the default boxes lose
 * the dash, and dashed grey boxes cannot be told apart); `lineWidthOf` gives a dataset's legend line width.
 */
export function lineLegendLabels(lineWidthOf: (dataset: { borderWidth?: number }) => number) {
  const generateLabels = (chart: ChartInstance): LegendItem[] =>
    Chart.defaults.plugins.legend.labels.generateLabels(chart).map((item) => {
      const ds = chart.data.datasets[item.datasetIndex ?? 0] as { borderDash?: number[]; borderColor?: string; borderWidth?: number };
      return { ...item, pointStyle: 'line', lineDash: ds.borderDash ?? [], strokeStyle: ds.borderColor, lineWidth: lineWidthOf(ds) };
    });
  return { ...chartText(), usePointStyle: true, pointStyleWidth: 28, generateLabels };
}

/** Tooltip of an attenuation-exceedance curve: the percentage of the year, then each curve in dB. */
export function exceedanceTooltip() {
  return {
    callbacks: {
      title: (items: TooltipItem<'line'>[]) => `${items[0]?.parsed.x} % of the year`,
      label: (item: TooltipItem<'line'>) => `${item.dataset.label}: ${(item.parsed.y ?? 0).toFixed(2)} dB`,
    },
  };
}
