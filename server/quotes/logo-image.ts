/**
 * Checks an uploaded logo by its bytes, not by the name or the type the browser claims: a PNG or
 * a baseline/progressive JPEG, at most 200 KiB and 2000 px a side. Pure: works on a Buffer.
 */
export const LOGO_MAX_BYTES = 200 * 1024;
export const LOGO_MAX_SIDE_PX = 2000;

export type LogoMime = 'image/png' | 'image/jpeg';
export interface LogoImage {
  mime: LogoMime;
  width: number;
  height: number;
}

export class LogoImageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LogoImageError';
  }
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function pngSize(b: Buffer): { width: number; height: number } {
  // PNG spec §5.3/§11.2.2: the first chunk is IHDR: length(4) type(4) width(4) height(4).
  if (b.length < 24 || b.toString('latin1', 12, 16) !== 'IHDR') throw new LogoImageError('This PNG file is damaged (no IHDR header).');
  return { width: b.readUInt32BE(16), height: b.readUInt32BE(20) };
}

function jpegSize(b: Buffer): { width: number; height: number } {
  // JPEG (ITU-T T.81 Annex B): walk the marker segments to the first SOFn frame header.
  let i = 2;
  while (i + 9 < b.length) {
    if (b[i] !== 0xff) throw new LogoImageError('This JPEG file is damaged (bad marker).');
    const marker = b[i + 1];
    if (marker === 0xff) {
      i += 1;
      continue;
    }
    const length = b.readUInt16BE(i + 2);
    const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isFrame) return { height: b.readUInt16BE(i + 5), width: b.readUInt16BE(i + 7) };
    if (length < 2) throw new LogoImageError('This JPEG file is damaged (bad segment length).');
    i += 2 + length;
  }
  throw new LogoImageError('This JPEG file is damaged (no frame header).');
}

/**
 * @example inspectLogo(readFileSync('logo.png')) // => { mime: 'image/png', width: 240, height: 80 }
 */
export function inspectLogo(bytes: Buffer): LogoImage {
  if (bytes.length === 0) throw new LogoImageError('The file is empty.');
  if (bytes.length > LOGO_MAX_BYTES) throw new LogoImageError(`The logo is ${Math.ceil(bytes.length / 1024)} KiB; the limit is ${LOGO_MAX_BYTES / 1024} KiB. Save it smaller (a few hundred pixels wide is plenty).`);
  let mime: LogoMime;
  let size: { width: number; height: number };
  if (bytes.subarray(0, 8).equals(PNG_SIGNATURE)) {
    mime = 'image/png';
    size = pngSize(bytes);
  } else if (bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) {
    mime = 'image/jpeg';
    size = jpegSize(bytes);
  } else {
    throw new LogoImageError('Only PNG and JPEG images can be used as a logo.');
  }
  if (size.width < 1 || size.height < 1) throw new LogoImageError('The image has no size.');
  if (size.width > LOGO_MAX_SIDE_PX || size.height > LOGO_MAX_SIDE_PX) {
    throw new LogoImageError(`The image is ${size.width} × ${size.height} px; at most ${LOGO_MAX_SIDE_PX} px a side, please.`);
  }
  return { mime, ...size };
}
