import { describe, expect, it } from 'vitest';
import { CsvRecordSplitter, MAX_RECORD_CHARS, parseCampaignBatch, type CsvRecord } from '@/server/campaigns/campaign-csv-stream';
import { parseCampaignCsv } from '@/server/campaigns/campaign-csv';

/** Feeds text to the splitter in pieces of `size` characters, as a network stream would. */
function split(text: string, size: number): CsvRecord[] {
  const s = new CsvRecordSplitter();
  const out: CsvRecord[] = [];
  for (let i = 0; i < text.length; i += size) s.push(text.slice(i, i + size), out);
  s.end(out);
  return out;
}

const HEADER = 'site_ref,latitude,longitude,altitude_m,current_dish_cm';

describe('CsvRecordSplitter', () => {
  it('gives the same records and line numbers whatever the piece size, with quoted line breaks kept in their cell', () => {
    const text = `\uFEFF${HEADER}\r\nA,47.1,2.1,100,60\r\n"B\nsecond line",47.2,2.2,,90\r\n\r\nC,47.3,2.3,100,45`;
    const expected = [
      { line: 1, text: HEADER },
      { line: 2, text: 'A,47.1,2.1,100,60' },
      { line: 3, text: '"B\nsecond line",47.2,2.2,,90' },
      { line: 5, text: '' },
      { line: 6, text: 'C,47.3,2.3,100,45' },
    ];
    for (const size of [1, 3, 7, 64, 10_000]) expect(split(text, size)).toEqual(expected);
  });

  it('reports a quote never closed on its own line and goes on with the next line', () => {
    const text = `${HEADER}\nA,47.1,2.1,100,60\nBROKEN,"47.5,2.25,120,60\n${'D,47.4,2.4,100,60\n'.repeat(300)}E,47.5,2.5,100,60\n`;
    const records = split(text, 1000);
    const broken = records.filter((r) => r.broken);
    expect(broken).toEqual([{ line: 3, text: '', broken: 'a quoted cell is opened with " but never closed.' }]);
    const good = records.filter((r) => !r.broken);
    expect(good[0]).toEqual({ line: 1, text: HEADER });
    expect(good[2]).toEqual({ line: 4, text: 'D,47.4,2.4,100,60' });
    expect(good.at(-1)).toEqual({ line: 304, text: 'E,47.5,2.5,100,60' });
  });

  it('reports an over-long line without a line break (not a site list) once, then resumes', () => {
    const text = `${HEADER}\n${'x'.repeat(MAX_RECORD_CHARS * 3)}\nA,47.1,2.1,100,60\n`;
    const records = split(text, 500);
    expect(records.filter((r) => r.broken)).toEqual([{ line: 2, text: '', broken: `the line is longer than ${MAX_RECORD_CHARS} characters.` }]);
    expect(records.at(-1)).toEqual({ line: 3, text: 'A,47.1,2.1,100,60' });
  });
});

describe('parseCampaignBatch', () => {
  it('reads a batch exactly as parseCampaignCsv reads the whole file, with the file’s line numbers', () => {
    const lines = [HEADER, 'A,47.1,2.1,100,60', 'B,north,2.2,100,60', 'C,47.3,2.3,,45', 'D,47.4,2.4,100,60,9', 'E,47.5,2.5,100,'];
    const whole = parseCampaignCsv(lines.join('\n') + '\n');
    // The batch starts at file line 4 (lines 2–3 were an earlier batch).
    const batch = parseCampaignBatch(HEADER, lines.slice(3).map((text, k) => ({ line: 4 + k, text })));
    expect(batch.rows).toEqual(whole.rows.filter((r) => r.line >= 4));
    expect(batch.problems).toEqual(whole.problems.filter((p) => (p.line ?? 0) >= 4));
    expect(batch.problems.map((p) => p.message)).toEqual(['Line 5 has 6 cells but the header has 5 columns.', 'Line 6, current_dish_cm: a value is required.']);
  });

  it('a quoting error costs only its own line', () => {
    const batch = parseCampaignBatch(HEADER, [
      { line: 2, text: 'A,47.1,2.1,100,60' },
      { line: 3, text: 'B,"47.2"x,2.2,100,60' },
      { line: 4, text: 'C,47.3,2.3,100,60' },
    ]);
    expect(batch.rows.map((r) => r.siteRef)).toEqual(['A', 'C']);
    expect(batch.problems.length).toBeGreaterThan(0);
    for (const p of batch.problems) expect(p).toMatchObject({ line: 3, message: expect.stringMatching(/^Line 3: /) });
  });
});
