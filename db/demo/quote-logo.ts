import { encodePng } from './png-encode';

/**
 * An invented logo for the demo company, drawn here pixel by pixel (no image from anywhere):
 * a teal rounded mark with a quill-like diagonal and three signal bars, on white. Encoded by png-encode.ts.
 */
const TEAL = [0x1b, 0x59, 0x55];
const LIGHT = [0xa9, 0xdc, 0xd6];
const WHITE = [0xff, 0xff, 0xff];

function pixel(x: number, y: number): number[] {
  // The mark: an 72 × 72 rounded square at (4, 4).
  const mx = x - 4;
  const my = y - 4;
  if (mx >= 0 && mx < 72 && my >= 0 && my < 72) {
    const r = 12;
    const cx = Math.min(Math.max(mx, r), 71 - r);
    const cy = Math.min(Math.max(my, r), 71 - r);
    if ((mx - cx) ** 2 + (my - cy) ** 2 <= r * r) {
      // A white diagonal stroke (the quill) from lower left to upper right.
      const d = Math.abs(mx + my - 72) / Math.SQRT2;
      if (d < 4 && mx > 14 && mx < 58) return WHITE;
      return TEAL;
    }
    return WHITE;
  }
  // Three signal bars of rising height to the right of the mark.
  for (const [i, h] of [28, 44, 60].entries()) {
    const bx = 92 + i * 22;
    if (x >= bx && x < bx + 14 && y >= 76 - h && y < 76) return i === 2 ? TEAL : LIGHT;
  }
  return WHITE;
}

export function demoLogoPng(width = 160, height = 80): Buffer {
  const pixels = Buffer.alloc(width * 3 * height);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) pixels.set(pixel(x, y), (y * width + x) * 3);
  return encodePng(width, height, 3, pixels);
}
