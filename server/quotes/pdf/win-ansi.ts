/**
 * The built-in PDF Helvetica only covers WinAnsiEncoding (PDF 32000-1 Annex D.2). Text that
 * people typed may hold anything, so it is folded to that set: known look-alikes are mapped,
 * the rest becomes "?" rather than a blank box or a crash.
 */
const EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
// The apostrophe becomes the ASCII one: as WinAnsi 0x92 it prints, but some viewers' copy, search and
// read-aloud text drop it ("manufacturer’s" came back as "manufacturers"); 0x27 survives all of them.
const MAP: Record<string, string> = { '‘': "'", '’': "'", '−': '-', '≤': '<=', '≥': '>=', '≈': '~', '→': '->', '←': '<-', '\u2009': ' ', '\u202f': ' ', '\u00a0': ' ' };

export function winAnsi(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (MAP[ch] !== undefined) out += MAP[ch];
    else if ((code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || code === 0x0a || EXTRA.has(ch)) out += ch;
    else out += '?';
  }
  return out;
}
