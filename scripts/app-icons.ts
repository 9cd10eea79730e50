/**
 * Draws FadeLedger's mark (a dish arc and its feed on our teal) into the app icons Next serves by
 * convention: app/icon.svg, app/apple-icon.png (180 px) and app/favicon.ico (16/32/48 px PNGs).
 * Run `npx tsx scripts/app-icons.ts` after changing the mark; the files are committed.
 */
import { writeFileSync } from 'node:fs';
import { encodePng } from '../db/demo/png-encode';

const TEAL = [0x1b, 0x59, 0x55] as const;
const WHITE = [0xff, 0xff, 0xff] as const;
// The mark in unit coordinates (y down): a quarter arc around the feed point, and the feed.
const FEED = { x: 0.3, y: 0.7 };
const ARC = { r: 0.42, width: 0.12 };
const DOT = 0.1;
const CORNER = 0.2;

function insideRoundedSquare(x: number, y: number): boolean {
  const cx = Math.min(Math.max(x, CORNER), 1 - CORNER);
  const cy = Math.min(Math.max(y, CORNER), 1 - CORNER);
  return (x - cx) ** 2 + (y - cy) ** 2 <= CORNER ** 2;
}

function isMark(x: number, y: number): boolean {
  const dx = x - FEED.x;
  const dy = y - FEED.y;
  const d = Math.hypot(dx, dy);
  if (d <= DOT) return true;
  // The arc opens towards the upper right, where the satellite is.
  return dx >= 0 && dy <= 0 && Math.abs(d - ARC.r) <= ARC.width / 2;
}

/** RGBA pixels, 4×4 samples per pixel for smooth edges. */
function draw(size: number): Buffer {
  const px = Buffer.alloc(size * size * 4);
  const n = 4;
  for (let j = 0; j < size; j++) {
    for (let i = 0; i < size; i++) {
      let bg = 0;
      let mark = 0;
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) {
          const x = (i + (a + 0.5) / n) / size;
          const y = (j + (b + 0.5) / n) / size;
          if (!insideRoundedSquare(x, y)) continue;
          bg++;
          if (isMark(x, y)) mark++;
        }
      }
      const o = (j * size + i) * 4;
      const t = bg ? mark / bg : 0;
      for (let c = 0; c < 3; c++) px[o + c] = Math.round(TEAL[c] * (1 - t) + WHITE[c] * t);
      px[o + 3] = Math.round((255 * bg) / (n * n));
    }
  }
  return px;
}

/** A PNG (ISO/IEC 15948) of the mark, 8-bit RGBA. */
function png(size: number): Buffer {
  return encodePng(size, size, 4, draw(size));
}

/** An ICO holding PNG images (supported by every current browser). */
function ico(sizes: number[]): Buffer {
  const images = sizes.map(png);
  const head = Buffer.alloc(6 + 16 * sizes.length);
  head.writeUInt16LE(0, 0);
  head.writeUInt16LE(1, 2);
  head.writeUInt16LE(sizes.length, 4);
  let offset = head.length;
  sizes.forEach((s, k) => {
    const e = 6 + 16 * k;
    head.writeUInt8(s >= 256 ? 0 : s, e);
    head.writeUInt8(s >= 256 ? 0 : s, e + 1);
    head.writeUInt16LE(1, e + 4);
    head.writeUInt16LE(32, e + 6);
    head.writeUInt32LE(images[k].length, e + 8);
    head.writeUInt32LE(offset, e + 12);
    offset += images[k].length;
  });
  return Buffer.concat([head, ...images]);
}

const f = (v: number) => +(v * 64).toFixed(2);
const arcStart = { x: FEED.x + ARC.r, y: FEED.y };
const arcEnd = { x: FEED.x, y: FEED.y - ARC.r };
const svg = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64">
  <rect width="64" height="64" rx="${f(CORNER)}" fill="#1b5955"/>
  <path d="M${f(arcEnd.x)} ${f(arcEnd.y)}A${f(ARC.r)} ${f(ARC.r)} 0 0 1 ${f(arcStart.x)} ${f(arcStart.y)}" fill="none" stroke="#fff" stroke-width="${f(ARC.width)}"/>
  <circle cx="${f(FEED.x)}" cy="${f(FEED.y)}" r="${f(DOT)}" fill="#fff"/>
</svg>
`;

writeFileSync('app/icon.svg', svg);
writeFileSync('app/apple-icon.png', png(180));
writeFileSync('app/favicon.ico', ico([16, 32, 48]));
console.log('app icons written: app/icon.svg, app/apple-icon.png, app/favicon.ico');
