import { declinationWords } from '@/server/pointing/magnetic-declination';
import { fixed } from './format';

/**
 * A plan view (compass rose: true north up, magnetic north marked, the look direction) and a side
 * view (the elevation above the horizon), drawn from the study's own angles — no map tiles.
 */
export function SkyCompass({ trueAzimuthDeg, magneticAzimuthDeg, declinationDeg, elevationDeg }: { trueAzimuthDeg: number; magneticAzimuthDeg: number; declinationDeg: number; elevationDeg: number }) {
  const c = 70;
  const r = 56;
  // SVG y grows downwards; a bearing θ from north, clockwise, is (sin θ, −cos θ).
  const at = (bearingDeg: number, radius: number) => {
    const a = (bearingDeg * Math.PI) / 180;
    return { x: c + radius * Math.sin(a), y: c - radius * Math.cos(a) };
  };
  const look = at(trueAzimuthDeg, r - 4);
  const mag = at(declinationDeg, r + 2);
  // The "M" sits beside the magnetic mark, on the side away from N, so a small declination does not hide either letter.
  const magLabel = at(declinationDeg + (declinationDeg >= 0 ? 9 : -9), r + 6);
  const ticks = Array.from({ length: 36 }, (_, i) => i * 10);
  const elev = Math.max(0, Math.min(90, elevationDeg));
  const e = (elev * Math.PI) / 180;
  const side = { x0: 12, y0: 112, len: 100 };
  const label = `Look direction: ${fixed(trueAzimuthDeg, 1)}° from true north (${fixed(magneticAzimuthDeg, 1)}° on a compass; magnetic north lies ${declinationWords(declinationDeg)} of true north), ${fixed(elevationDeg, 1)}° above the horizon.`;
  return (
    <figure className="flex flex-wrap items-end justify-center gap-4">
      <svg viewBox="0 0 140 140" width="140" height="140" role="img" aria-labelledby="sky-compass-title" className="shrink-0 print:h-32 print:w-32">
        <title id="sky-compass-title">{label}</title>
        <circle cx={c} cy={c} r={r} fill="#fafaf9" stroke="#a8a29e" strokeWidth="1" />
        {ticks.map((t) => {
          const a = at(t, r);
          const b = at(t, t % 90 === 0 ? r - 7 : r - 3);
          return <line key={t} x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke="#a8a29e" strokeWidth={t % 90 === 0 ? 1.2 : 0.6} />;
        })}
        <text x={c} y={c - r - 4} textAnchor="middle" fontSize="10" fontWeight="600" fill="#1c1917">N</text>
        <text x={c + r + 5} y={c + 3.5} textAnchor="start" fontSize="9" fill="#57534e">E</text>
        <text x={c} y={c + r + 11} textAnchor="middle" fontSize="9" fill="#57534e">S</text>
        <text x={c - r - 5} y={c + 3.5} textAnchor="end" fontSize="9" fill="#57534e">W</text>
        {/* Magnetic north: a dashed mark at the declination. */}
        <line x1={c} y1={c} x2={mag.x} y2={mag.y} stroke="#b45309" strokeWidth="1" strokeDasharray="3 2" />
        <text x={magLabel.x} y={magLabel.y + 3} textAnchor="middle" fontSize="8" fill="#b45309">M</text>
        <line x1={c} y1={c} x2={look.x} y2={look.y} stroke="#1b5955" strokeWidth="2.5" strokeLinecap="round" />
        <circle cx={look.x} cy={look.y} r="3.5" fill="#1b5955" />
        <circle cx={c} cy={c} r="2" fill="#1c1917" />
      </svg>
      <svg viewBox="0 0 130 130" width="130" height="130" role="img" aria-labelledby="sky-elevation-title" className="shrink-0 print:h-32 print:w-32">
        <title id="sky-elevation-title">{`Elevation: the dish looks ${fixed(elevationDeg, 1)}° above the horizon.`}</title>
        <path d={`M ${side.x0 + side.len} ${side.y0} A ${side.len} ${side.len} 0 0 0 ${side.x0} ${side.y0 - side.len}`} fill="none" stroke="#d6d3d1" strokeWidth="1" />
        {elev < 10 && <path d={`M ${side.x0} ${side.y0} L ${side.x0 + side.len} ${side.y0} A ${side.len} ${side.len} 0 0 0 ${side.x0 + side.len * Math.cos((10 * Math.PI) / 180)} ${side.y0 - side.len * Math.sin((10 * Math.PI) / 180)} Z`} fill="#fef3c7" />}
        <line x1={side.x0} y1={side.y0} x2={side.x0 + side.len + 6} y2={side.y0} stroke="#57534e" strokeWidth="1.2" />
        <text x={side.x0 + side.len + 6} y={side.y0 + 12} textAnchor="end" fontSize="9" fill="#57534e">horizon</text>
        <line x1={side.x0} y1={side.y0} x2={side.x0 + (side.len - 4) * Math.cos(e)} y2={side.y0 - (side.len - 4) * Math.sin(e)} stroke="#1b5955" strokeWidth="2.5" strokeLinecap="round" />
        <circle cx={side.x0 + (side.len - 4) * Math.cos(e)} cy={side.y0 - (side.len - 4) * Math.sin(e)} r="3.5" fill="#1b5955" />
        <path d={`M ${side.x0 + 28} ${side.y0} A 28 28 0 0 0 ${side.x0 + 28 * Math.cos(e)} ${side.y0 - 28 * Math.sin(e)}`} fill="none" stroke="#1b5955" strokeWidth="1" />
        <text x={side.x0 + 34} y={side.y0 - 6} fontSize="9" fill="#1c1917">{`${fixed(elevationDeg, 1)}°`}</text>
      </svg>
      <figcaption className="w-full text-center text-xs text-stone-600">{label}</figcaption>
    </figure>
  );
}
