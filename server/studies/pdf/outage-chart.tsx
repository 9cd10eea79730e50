import { Circle, Line, Polyline, Svg, Text } from '@react-pdf/renderer';
import type { StudyResultSnapshot } from '@/server/studies/snapshot';
import { allowedMinutesPerYear, readStudyOption } from '@/server/study-option';

const TEAL = '#1b5955';
const MUTED = '#57534e';
const RULE = '#d6d3d1';
const AMBER = '#b45309';

/**
 * Outage minutes per year against dish diameter, drawn in the PDF itself (no browser chart):
 * a log scale, because a small dish can miss thousands of minutes and a large one a handful.
 * Dishes that never close have no point; the target's allowed outage is a dashed line. The
 * figures themselves are in the table above, so the points carry no labels that could collide.
 */
export function PdfOutageChart({ result, targetPercent, width = 500, height = 170 }: { result: StudyResultSnapshot; targetPercent: number; width?: number; height?: number }) {
  const t = result.tradeoff;
  const pts = t.options
    .map((o, i) => ({ o, r: readStudyOption(t, i) }))
    .filter(({ r }) => r.closes)
    .map(({ o, r }) => ({ dM: o.diameterM, min: Math.max(r.figures.outageMinutesPerYear, 0.1), cm: r.diameter.cm }));
  const allowed = allowedMinutesPerYear(targetPercent);
  const left = 46;
  const right = 12;
  const top = 18;
  // Points sit inside the plot, clear of the axis and of the edge labels.
  const inset = 24;
  const bottom = 30;
  const ds = t.options.map((o) => o.diameterM);
  const dMin = Math.min(...ds);
  const dMax = Math.max(...ds);
  const values = [...pts.map((p) => p.min), ...(allowed ? [allowed] : [])];
  const lo = Math.floor(Math.log10(Math.min(...values, 1)));
  const hi = Math.ceil(Math.log10(Math.max(...values, 10)));
  const x = (d: number) => left + inset + (dMax === dMin ? 0.5 : (d - dMin) / (dMax - dMin)) * (width - left - right - 2 * inset);
  const y = (m: number) => top + (1 - (Math.log10(m) - lo) / (hi - lo)) * (height - top - bottom);
  const decades = Array.from({ length: hi - lo + 1 }, (_, k) => lo + k);
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      {decades.map((e) => (
        <Line key={`g${e}`} x1={left} x2={width - right} y1={y(10 ** e)} y2={y(10 ** e)} stroke={RULE} strokeWidth={0.5} />
      ))}
      {decades.map((e) => (
        <Text key={`l${e}`} x={left - 4} y={y(10 ** e) + 2.5} style={{ fontSize: 7, fill: MUTED }} textAnchor="end">
          {(10 ** e).toLocaleString('en-US', { maximumFractionDigits: 1 })}
        </Text>
      ))}
      <Line x1={left} x2={width - right} y1={height - bottom} y2={height - bottom} stroke={MUTED} strokeWidth={0.8} />
      <Line x1={left} x2={left} y1={top} y2={height - bottom} stroke={MUTED} strokeWidth={0.8} />
      {t.options.map((o, i) => (
        <Text key={`x${i}`} x={x(o.diameterM)} y={height - bottom + 10} style={{ fontSize: 7, fill: MUTED }} textAnchor="middle">
          {readStudyOption(t, i).diameter.cm}
        </Text>
      ))}
      <Text x={(left + width - right) / 2} y={height - 4} style={{ fontSize: 7.5, fill: MUTED }} textAnchor="middle">
        Dish diameter
      </Text>
      <Text x={left - 4} y={8} style={{ fontSize: 7.5, fill: MUTED }} textAnchor="end">
        min/yr
      </Text>
      {allowed !== null && allowed > 0 && (
        <>
          <Line x1={left} x2={width - right} y1={y(allowed)} y2={y(allowed)} stroke={AMBER} strokeWidth={0.8} strokeDasharray="3 2" />
          {/* Above the line at the large-dish end: the dishes there usually meet the target, so their points lie below it. */}
          <Text x={width - right} y={y(allowed) - 3} style={{ fontSize: 7, fill: AMBER }} textAnchor="end">
            {`target ${targetPercent} %: ${Math.round(allowed).toLocaleString('en-US')} min/yr allowed`}
          </Text>
        </>
      )}
      {pts.length > 1 && <Polyline points={pts.map((p) => `${x(p.dM)},${y(p.min)}`).join(' ')} fill="none" stroke={TEAL} strokeWidth={1.5} />}
      {pts.map((p) => (
        <Circle key={p.cm} cx={x(p.dM)} cy={y(p.min)} r={2.5} fill={TEAL} />
      ))}
    </Svg>
  );
}
