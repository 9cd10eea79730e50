import { deflateSync } from 'node:zlib';

/**
 * An invented logo for the demo company, drawn here pixel by pixel (no image from anywhere):
 * a teal rounded mark with a quill-like diagonal and three signal bars, on white. Encoded as a
 * PNG (PNG spec: signature, IHDR, IDAT of filtered scanlines, IEND; CRC-32 per chunk).
 */
const CRC_TABLE = (() => {
  const t = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t[n] = c >>> 0;
  }
  return t;
})();

function crc32(buf: Buffer): number {
  let c = 0xffffffff;
  for (const b of buf) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

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
  const raw = Buffer.alloc((width * 3 + 1) * height);
  for (let y = 0; y < height; y++) {
    const row = y * (width * 3 + 1);
    raw[row] = 0; // filter type 0 (None)
    for (let x = 0; x < width; x++) {
      const [r, g, b] = pixel(x, y);
      raw[row + 1 + x * 3] = r;
      raw[row + 2 + x * 3] = g;
      raw[row + 3 + x * 3] = b;
    }
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour RGB
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]);
}
