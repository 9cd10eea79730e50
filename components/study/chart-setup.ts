'use client';

import { CategoryScale, Chart, Filler, Legend, LinearScale, LineElement, LogarithmicScale, PointElement, Tooltip } from 'chart.js';

// Register only what the study charts draw (tree-shaken chart.js).
Chart.register(LinearScale, LogarithmicScale, CategoryScale, PointElement, LineElement, Tooltip, Legend, Filler);

/** Chart colours: the ledger teal for data, stone for guides; one accent only (product.md). */
export const CHART = {
  line: '#1f6f69',
  lineSoft: 'rgba(31, 111, 105, 0.12)',
  guide: '#78716c',
  grid: '#e7e5e4',
  text: '#44403c',
  font: { family: 'var(--font-ui), system-ui, sans-serif', size: 12 },
} as const;

/** Stone shades for the per-dish fade-threshold lines, darkest for the largest dish. */
export function thresholdShade(i: number, n: number): string {
  const t = n <= 1 ? 0.5 : i / (n - 1);
  const l = Math.round(70 - t * 45);
  return `hsl(176 35% ${l}%)`;
}
