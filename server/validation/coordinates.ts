/**
 * Site coordinates as people type them: decimal degrees ("-12.5", "12.5 S") or degrees, minutes
 * and seconds ("12°30'15\" S", "12 30 15 S", "S 12° 30.25'", "12d30m15s"). Returns decimal degrees,
 * north and east positive, rounded to 6 places (about 0.1 m — the precision stored). Used by the
 * site form in the browser and by the server, so the two always agree.
 *
 * Rule for bad input: a clear message naming what is wrong (minutes ≥ 60, a hemisphere letter of
 * the other axis, a sign together with S/W, out of range…), never a guess.
 *
 * @example
 * parseCoordinate(`51°28'38"N`, 'lat') // => { ok: true, value: 51.477222 }
 * parseCoordinate('0 7 39 W', 'lon')   // => { ok: true, value: -0.1275 }
 * parseCoordinate('12 75 0 N', 'lat')  // => { ok: false, error: 'Minutes must be below 60.' }
 */
export type CoordinateAxis = 'lat' | 'lon';
export type CoordinateParse = { ok: true; value: number } | { ok: false; error: string };

const LIMIT_DEG: Record<CoordinateAxis, number> = { lat: 90, lon: 180 };
const HEMISPHERES: Record<CoordinateAxis, { positive: string; negative: string }> = {
  lat: { positive: 'N', negative: 'S' },
  lon: { positive: 'E', negative: 'W' },
};
const AXIS_WORD: Record<CoordinateAxis, string> = { lat: 'Latitude', lon: 'Longitude' };

// Degree, minute and second marks people paste from maps, GPS units and spreadsheets.
// Letter marks (12d30m15s) are refused: a trailing "s" cannot be told from South.
const DEGREE_MARKS = /[°º˚]/g;
const MINUTE_MARKS = /['′’‘`]/g;
const SECOND_MARKS = /["″”“]|''|′′/g;

function round6(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

/** Plain decimal degrees with an optional sign: what almost every row of a campaign file holds. */
const PLAIN_DECIMAL = /^([+-]?)(\d+(?:\.\d+)?|\.\d+)$/;

function withinLimit(value: number, axis: CoordinateAxis): CoordinateParse {
  const limit = LIMIT_DEG[axis];
  if (!Number.isFinite(value) || Math.abs(value) > limit) {
    return { ok: false, error: `${AXIS_WORD[axis]} must be between -${limit} and ${limit} degrees.` };
  }
  return { ok: true, value: round6(value) === 0 ? 0 : round6(value) };
}

export function parseCoordinate(text: string, axis: CoordinateAxis): CoordinateParse {
  const word = AXIS_WORD[axis];
  // Kept as typed (not upper-cased) so a message quotes the person's own text back to them.
  const s0 = String(text ?? '').trim();
  // The general reading below gives the same answer for these; skipping its string work matters
  // when a million-site file is read (server/campaigns/stage-campaign-file.ts).
  const plain = PLAIN_DECIMAL.exec(s0);
  if (plain) return withinLimit((plain[1] === '-' ? -1 : 1) * Number(plain[2]), axis);
  let s = s0;
  if (s === '') return { ok: false, error: `${word} is required.` };
  s = s.replace(/,/g, '.');

  // One hemisphere letter, at the start or the end, in either case.
  let hemisphere: string | null = null;
  const lead = /^([NSEW])(?![A-Z])\s*/i.exec(s);
  const trail = /\s*(?<![A-Z])([NSEW])$/i.exec(s);
  if (lead && trail && lead.index !== trail.index) return { ok: false, error: `${word}: give the hemisphere once.` };
  if (lead) {
    hemisphere = lead[1].toUpperCase();
    s = s.slice(lead[0].length);
  } else if (trail) {
    hemisphere = trail[1].toUpperCase();
    s = s.slice(0, trail.index);
  }
  if (hemisphere) {
    const { positive, negative } = HEMISPHERES[axis];
    if (hemisphere !== positive && hemisphere !== negative) {
      const other = axis === 'lat' ? 'longitude (E/W)' : 'latitude (N/S)';
      return { ok: false, error: `${word}: "${hemisphere}" is a ${other} letter; use ${positive} or ${negative}.` };
    }
  }

  let sign = 1;
  const signMatch = /^([+-])\s*/.exec(s);
  if (signMatch) {
    sign = signMatch[1] === '-' ? -1 : 1;
    s = s.slice(signMatch[0].length);
  }
  if (hemisphere && signMatch) {
    return { ok: false, error: `${word}: use either a sign or ${HEMISPHERES[axis].positive}/${HEMISPHERES[axis].negative}, not both.` };
  }
  if (hemisphere === HEMISPHERES[axis].negative) sign = -1;

  // Separators (marks, colons, spaces) between up to three numbers.
  const parts = s
    .replace(SECOND_MARKS, ' ')
    .replace(DEGREE_MARKS, ' ')
    .replace(MINUTE_MARKS, ' ')
    .replace(/:/g, ' ')
    .trim()
    .split(/\s+/)
    .filter((p) => p !== '');
  if (parts.length === 0 || parts.length > 3) {
    return { ok: false, error: `${word}: write decimal degrees (e.g. 12.5) or degrees, minutes, seconds (e.g. 12°30'00").` };
  }
  const numbers: number[] = [];
  for (const part of parts) {
    if (!/^\d+(\.\d+)?$|^\.\d+$/.test(part)) {
      return { ok: false, error: `${word}: "${part}" is not a number.` };
    }
    numbers.push(Number(part));
  }
  // Only the last given part may carry decimals (12.5° 30' is ambiguous).
  for (let i = 0; i < parts.length - 1; i++) {
    if (parts[i].includes('.')) return { ok: false, error: `${word}: only the last part may have decimals.` };
  }
  const [deg, min = 0, sec = 0] = numbers;
  if (parts.length >= 2 && min >= 60) return { ok: false, error: 'Minutes must be below 60.' };
  if (parts.length === 3 && sec >= 60) return { ok: false, error: 'Seconds must be below 60.' };
  return withinLimit(sign * (deg + min / 60 + sec / 3600), axis);
}

/**
 * Decimal degrees as degrees, minutes and seconds with the hemisphere letter, seconds to one decimal.
 * @example formatDms(-0.1275, 'lon') // => `0° 07′ 39.0″ W`
 */
export function formatDms(valueDeg: number, axis: CoordinateAxis): string {
  const { positive, negative } = HEMISPHERES[axis];
  const letter = valueDeg < 0 ? negative : positive;
  // Work in tenths of a second so 59.96″ rounds up into the next minute instead of showing 60.0″.
  const tenths = Math.round(Math.abs(valueDeg) * 36000);
  const deg = Math.floor(tenths / 36000);
  const min = Math.floor((tenths % 36000) / 600);
  const sec = (tenths % 600) / 10;
  return `${deg}° ${String(min).padStart(2, '0')}′ ${sec.toFixed(1).padStart(4, '0')}″ ${letter}`;
}
