import { describe, expect, it } from 'vitest';
import { CampaignFileText, CAMPAIGN_UPLOAD_MAX_BYTES } from '@/server/campaigns/campaign-file-text';
import { InvalidInputError } from '@/server/errors';

const bytes = (s: string) => new TextEncoder().encode(s);

/** Feeds bytes in pieces of `size`, as a request body arrives, and returns the text or the refusal. */
function read(data: Uint8Array, size: number, filename = 'sites.csv', maxBytes?: number): string {
  const file = new CampaignFileText(filename, maxBytes);
  let text = '';
  for (let i = 0; i < data.length; i += size) text += file.decode(data.subarray(i, i + size));
  return text + file.end();
}

const refusal = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InvalidInputError);
    expect((e as InvalidInputError).fieldErrors.file).toEqual([(e as Error).message]);
    return (e as Error).message;
  }
  throw new Error('expected a refusal');
};

describe('CampaignFileText (the one reader of a campaign file’s bytes)', () => {
  it('gives the same text whatever the piece size, with characters split between pieces joined', () => {
    // "é" and "°" are two bytes, "≥" three: pieces of 1–4 bytes cut through them.
    const text = 'site_ref,latitude,longitude,current_dish_cm\nCafé Nord,"47°15\'00"" N",2.5,60\nRelais ≥ 3,47.1,2.1,90\n';
    for (const size of [1, 2, 3, 4, 64, 65_536]) expect(read(bytes(text), size)).toBe(text);
  });

  it('refuses an empty file', () => {
    expect(refusal(() => read(new Uint8Array(0), 10, 'a.csv'))).toBe('"a.csv" is empty.');
  });

  it('refuses a NUL byte anywhere (a spreadsheet’s binary format, an archive), in whatever piece it comes', () => {
    const data = bytes('site_ref,latitude\nA,47\u0000\n');
    for (const size of [1, 5, 100]) expect(refusal(() => read(data, size, 'a.xlsx'))).toBe('"a.xlsx" is not a text CSV file (it contains binary data). Save it from your spreadsheet as CSV.');
  });

  it('refuses bytes that are not UTF-8, and a file that ends inside a character', () => {
    const latin1 = new Uint8Array([0x61, 0x2c, 0xe9, 0x0a]); // "a,é\n" saved as Latin-1
    expect(refusal(() => read(latin1, 2))).toBe('"sites.csv" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".');
    const cut = bytes('a,é').subarray(0, 3); // the first byte of "é" only
    expect(refusal(() => read(cut, 1))).toContain('is not UTF-8 text');
  });

  it('accepts exactly the size cap and refuses one byte more, naming the cap', () => {
    const cap = 4096;
    expect(read(new Uint8Array(cap).fill(65), 1000, 'a.csv', cap)).toHaveLength(cap);
    expect(refusal(() => read(new Uint8Array(cap + 1).fill(65), 1000, 'a.csv', cap))).toBe('"a.csv" is over 4 KiB; a campaign file of a million sites is about 100 MB. Split it into several campaigns.');
    expect(CAMPAIGN_UPLOAD_MAX_BYTES).toBe(200 * 1024 * 1024);
    const file = new CampaignFileText('big.csv');
    expect(refusal(() => file.decode(new Uint8Array(CAMPAIGN_UPLOAD_MAX_BYTES + 1)))).toBe('"big.csv" is over 200 MB; a campaign file of a million sites is about 100 MB. Split it into several campaigns.');
  });
});
