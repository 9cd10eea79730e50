import { describe, expect, it } from 'vitest';
import { inspectLogo, LogoImageError, LOGO_MAX_BYTES } from '@/server/quotes/logo-image';

/** A minimal PNG header: signature + IHDR with the given size (PNG spec §5.2, §11.2.2). */
function pngHeader(width: number, height: number): Buffer {
  const b = Buffer.alloc(33);
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]).copy(b, 0);
  b.writeUInt32BE(13, 8);
  b.write('IHDR', 12, 'latin1');
  b.writeUInt32BE(width, 16);
  b.writeUInt32BE(height, 20);
  return b;
}

/** SOI, an APP0 segment, then SOF0 with the given size (ITU-T T.81 B.2.2). */
function jpegHeader(width: number, height: number): Buffer {
  const app0 = Buffer.from([0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00]);
  const sof = Buffer.from([0xff, 0xc0, 0x00, 0x11, 0x08, height >> 8, height & 0xff, width >> 8, width & 0xff, 0x03, 1, 0x22, 0, 2, 0x11, 1, 3, 0x11, 1]);
  return Buffer.concat([Buffer.from([0xff, 0xd8]), app0, sof, Buffer.from([0xff, 0xd9])]);
}

describe('inspectLogo', () => {
  it('reads PNG and JPEG sizes from their headers', () => {
    expect(inspectLogo(pngHeader(240, 80))).toEqual({ mime: 'image/png', width: 240, height: 80 });
    expect(inspectLogo(jpegHeader(300, 120))).toEqual({ mime: 'image/jpeg', width: 300, height: 120 });
  });

  describe('edge cases', () => {
    it('refuses empty, oversized, foreign and damaged files with a clear message', () => {
      expect(() => inspectLogo(Buffer.alloc(0))).toThrow(/empty/);
      expect(() => inspectLogo(Buffer.concat([pngHeader(10, 10), Buffer.alloc(LOGO_MAX_BYTES)]))).toThrow(/limit is 200 KiB/);
      expect(() => inspectLogo(Buffer.from('GIF89a...........'))).toThrow(/Only PNG and JPEG/);
      expect(() => inspectLogo(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toThrow(LogoImageError);
      expect(() => inspectLogo(pngHeader(10, 10).subarray(0, 16))).toThrow(/damaged/);
      expect(() => inspectLogo(Buffer.from([0xff, 0xd8, 0xff, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00]))).toThrow(/damaged/);
    });
    it('refuses images larger than 2000 px a side', () => {
      expect(() => inspectLogo(pngHeader(2001, 100))).toThrow(/2001 × 100 px/);
    });
  });
});
