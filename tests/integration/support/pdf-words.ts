import { inflateSync } from 'node:zlib';

/** Raw PDF plus every Flate-compressed stream inflated (PDF 32000-1 §7.4.4): for object dictionaries. */
export function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  let out = raw;
  const re = /stream\r?\n/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(raw))) {
    const start = m.index + m[0].length;
    try {
      out += inflateSync(pdf.subarray(start, raw.indexOf('endstream', start))).toString('latin1');
    } catch {
      /* not compressed */
    }
  }
  return out;
}

/**
 * WinAnsiEncoding (PDF 32000-1 Annex D.2) is Latin-1 except 0x80–0x9F, which hold € ‚ ƒ „ … † ‡ ˆ ‰ Š ‹ Œ Ž
 * ‘ ’ “ ” • – — ˜ ™ š › œ ž Ÿ. Spelled out here: Node 20's TextDecoder('windows-1252') decodes as Latin-1.
 */
const WIN_ANSI_80_9F = '€\u0081‚ƒ„…†‡ˆ‰Š‹Œ\u008dŽ\u008f\u0090‘’“”•–—˜™š›œ\u009džŸ';
const winAnsi = { decode: (bytes: Buffer) => [...bytes].map((b) => (b >= 0x80 && b <= 0x9f ? WIN_ANSI_80_9F[b - 0x80] : String.fromCharCode(b))).join('') };

/**
 * The words printed on the pages: react-pdf writes each line as a TJ array of hex strings in
 * WinAnsi codes (PDF 32000-1 §9.4.3), kerning numbers in between; lines are joined by spaces.
 */
export function pdfWords(pdf: Buffer): string {
  const lines = [...pdfText(pdf).matchAll(/\[((?:<[0-9a-fA-F]*>\s*-?[\d.]*\s*)+)\]\s*TJ/g)].map((m) =>
    [...m[1].matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => winAnsi.decode(Buffer.from(h[1], 'hex'))).join(''),
  );
  return lines.join(' ').replace(/\s+/g, ' ');
}
