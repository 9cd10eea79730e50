import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseUpload } from '@/server/uploads/parse-upload';
import { MAX_UPLOAD_BYTES } from '@/server/uploads/upload-limits';
import { readCsvTable } from '@/server/uploads/csv-table';
import { referenceDir } from '../engine/reference-csv';

const bytes = (s: string) => new TextEncoder().encode(s);
const DISH_HEADER = 'name,diameter_m,efficiency,hardware_price,labour_price,mount_notes,active';

// Invented catalogue rows (demo data, no real products).
const goodDishes = [
  DISH_HEADER,
  'Ledger 60,0.60,0.65,89.00,120.00,Wall bracket,yes',
  'Ledger 75,0.75,0.66,129.00,140.00,,',
  'Ledger 90,0.90,0.67,189.00,160.00,"Pole mount, 60 mm",yes',
].join('\n');

describe('dish catalogue CSV', () => {
  it('accepts a good file and normalises money to 2 decimals', () => {
    const r = parseUpload('dish-catalogue', bytes(goodDishes), 'dishes.csv');
    expect(r.report.ok).toBe(true);
    expect(r.report.rowCount).toBe(3);
    if (r.kind !== 'dish-catalogue') throw new Error('kind');
    expect(r.dishes.map((d) => [d.name, d.diameterM, d.hardwarePrice, d.active, d.line])).toEqual([
      ['Ledger 60', 0.6, '89.00', true, 2],
      ['Ledger 75', 0.75, '129.00', true, 3],
      ['Ledger 90', 0.9, '189.00', true, 4],
    ]);
    expect(r.dishes[2].mountNotes).toBe('Pole mount, 60 mm');
  });

  it('names a bad number on line 7 by line and column, and returns no rows', () => {
    const lines = [DISH_HEADER];
    for (let i = 0; i < 5; i++) lines.push(`Dish ${i},${0.6 + i * 0.1},0.65,100,50,,yes`);
    lines.push('Dish bad,0.9O,0.65,100,50,,yes'); // line 7: letter O instead of zero
    const r = parseUpload('dish-catalogue', bytes(lines.join('\n')), 'dishes.csv');
    expect(r.report.ok).toBe(false);
    expect(r.report.problems).toEqual([{ line: 7, column: 'diameter_m', message: 'Line 7, diameter_m: "0.9O" is not a number (use a decimal point, e.g. 0.65).' }]);
    if (r.kind === 'dish-catalogue') expect(r.dishes).toEqual([]);
  });

  it('refuses wrong columns, naming the missing ones and the expected header', () => {
    const r = parseUpload('dish-catalogue', bytes('p_percent,rain_rate_mm_h\n0.01,42\n'), 'rain.csv');
    expect(r.report.ok).toBe(false);
    expect(r.report.problems[0].message).toMatch(/^Missing columns: name, diameter_m, efficiency, hardware_price, labour_price\. The first line must name the columns/);
  });

  it('refuses an empty file, a header-only file and a file of blank lines', () => {
    expect(parseUpload('dish-catalogue', new Uint8Array(), 'empty.csv').report.problems[0].message).toBe('"empty.csv" is empty.');
    expect(parseUpload('dish-catalogue', bytes('\n\n  \n'), 'blank.csv').report.problems[0].message).toBe('The file is empty.');
    expect(parseUpload('dish-catalogue', bytes(DISH_HEADER + '\n'), 'head.csv').report.problems[0].message).toBe('The file has a header line but no data rows.');
  });

  it('refuses a file over the size limit before reading it', () => {
    const huge = bytes(DISH_HEADER + '\n' + 'x'.repeat(MAX_UPLOAD_BYTES));
    const r = parseUpload('dish-catalogue', huge, 'huge.csv');
    expect(r.report.ok).toBe(false);
    expect(r.report.problems[0].message).toBe('"huge.csv" is 257 KiB; uploads are limited to 256 KiB. Split the file or remove unused columns.');
  });

  it('refuses binary and non-UTF-8 files', () => {
    expect(parseUpload('dish-catalogue', new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00]), 'book.xlsx').report.problems[0].message).toMatch(/not a text CSV file/);
    expect(parseUpload('dish-catalogue', new Uint8Array([0x6e, 0x61, 0x6d, 0x65, 0xe9, 0x0a]), 'latin1.csv').report.problems[0].message).toMatch(/not UTF-8/);
  });

  it('reports every bad cell, duplicate names and out-of-range values', () => {
    const csv = [DISH_HEADER, 'A,0.6,0.65,100,50,,maybe', 'A,0.7,0.65,100,50,,', 'B,20,0.65,100,50,,', 'C,0.8,0.65,12.345,50,,', 'D,0.8,1.5,100,-5,,'].join('\n');
    const r = parseUpload('dish-catalogue', bytes(csv), 'd.csv');
    const byLine = r.report.problems.map((p) => [p.line, p.column]);
    expect(byLine).toEqual([
      [2, 'active'],
      [3, 'name'],
      [4, 'diameter_m'],
      [5, 'hardware_price'],
      [6, 'efficiency'],
      [6, 'labour_price'],
    ]);
    expect(r.report.problems[2].message).toBe('Line 4, diameter_m: Diameter must be between 0.3 and 13 m.');
  });

  // Edge cases: semicolon separator, BOM, CRLF, header spelled loosely, quoted newline keeps line numbers.
  it('reads semicolons, a BOM, CRLF line ends and loose headers; quoted newlines keep later line numbers right', () => {
    const csv = '\uFEFFName;Diameter (m);Efficiency;Hardware price;Labour price;Mount notes\r\nA;0.6;0.65;100;50;"two\r\nlines"\r\nB;x;0.65;100;50;\r\n';
    const r = parseUpload('dish-catalogue', bytes(csv), 'd.csv');
    expect(r.report.problems).toEqual([{ line: 4, column: 'diameter_m', message: expect.stringContaining('Line 4') }]);
  });
});

describe('measured rain-rate curve CSV', () => {
  // An invented curve for tests (demo data, no real station).
  const good = 'p_percent,rain_rate_mm_h\n1,2.1\n0.3,6.5\n0.1,12.4\n0.03,24\n0.01,41.5\n0.003,66\n0.001,92\n';

  it('accepts a falling curve through 0.01 % and sorts it from the largest p', () => {
    const r = parseUpload('rain-curve', bytes(good), 'curve.csv');
    expect(r.report.ok).toBe(true);
    if (r.kind !== 'rain-curve') throw new Error('kind');
    expect(r.points[0]).toEqual({ pPercent: 1, rainRateMmH: 2.1 });
    expect(r.points).toHaveLength(7);
    expect(r.report.summary).toBe('7 points from 0.001 % to 1 % of the year, all valid.');
  });

  it('refuses a rain rate that falls as p gets smaller, on its line', () => {
    const r = parseUpload('rain-curve', bytes('p_percent,rain_rate_mm_h\n1,2\n0.1,12\n0.01,9\n'), 'c.csv');
    expect(r.report.problems).toEqual([{ line: 4, column: 'rain_rate_mm_h', message: expect.stringMatching(/^Line 4: The rain rate must not fall/) }]);
  });

  it('refuses a curve that does not reach 0.01 % (never extrapolated)', () => {
    const r = parseUpload('rain-curve', bytes('p_percent,rain_rate_mm_h\n1,2\n0.1,12\n0.03,20\n'), 'c.csv');
    expect(r.report.problems[0].message).toMatch(/covers 0.03–1 % of the year but must include 0.01 %/);
  });

  it('refuses p outside (0, 100] and non-numbers, each with its line', () => {
    const r = parseUpload('rain-curve', bytes('p_percent,rain_rate_mm_h\n0,2\n150,3\nabc,4\n0.01,-1\n'), 'c.csv');
    expect(r.report.problems.map((p) => [p.line, p.column])).toEqual([
      [2, 'p_percent'],
      [3, 'p_percent'],
      [4, 'p_percent'],
      [5, 'rain_rate_mm_h'],
    ]);
  });

  it('refuses a duplicate p', () => {
    const r = parseUpload('rain-curve', bytes('p_percent,rain_rate_mm_h\n0.1,10\n0.01,30\n0.01,31\n'), 'c.csv');
    expect(r.report.problems[0].message).toMatch(/appears twice/);
  });
});

describe('monthly climate normals CSV', () => {
  // Monthly MT and T of ITU-R P.837-7 validation site V2 (../shared/reference/itu-p837-7-monthly-climate.csv),
  // whose R0.01 by Annex 1 is given in itu-p837-7-rain-rate.csv.
  const refDir = referenceDir();
  const monthly = fs.readFileSync(path.join(refDir, 'itu-p837-7-monthly-climate.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
  const rates = fs.readFileSync(path.join(refDir, 'itu-p837-7-rain-rate.csv'), 'utf8').trim().split('\n');
  const rateHeader = rates[0].split(',');
  const site = monthly[0][0];
  const siteRows = monthly.filter((r) => r[0] === site);
  const csv = 'month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + siteRows.map((r) => `${r[3]},${r[4]},${r[5]}`).join('\n') + '\n';

  it(`reads 12 months of site ${site} and the preview gives the published R0.01 (ITU-R SG 3 validation examples, P.837-7)`, () => {
    const r = parseUpload('climate-normals', bytes(csv), 'normals.csv');
    expect(r.report.ok).toBe(true);
    if (r.kind !== 'climate-normals' || !r.normals) throw new Error('kind');
    expect(r.normals.monthlyRainfallMm).toHaveLength(12);
    expect(r.normals.monthlyRainfallMm[0]).toBeCloseTo(Number(siteRows[0][4]), 10);
    const row = rates.slice(1).map((l) => l.split(',')).find((c) => c[0] === site && Number(c[rateHeader.indexOf('p_percent')]) === 0.01);
    if (row) {
      const published = Number(row[rateHeader.indexOf('rain_rate_mm_h')]);
      const shown = Number(/R0\.01 = ([\d.]+) mm\/h/.exec(r.report.summary)![1]);
      // The summary rounds to 0.1 mm/h.
      expect(Math.abs(shown - published)).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  it('accepts month names in any order', () => {
    const names = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
    const lines = names.map((n, i) => `${n},${50 + i},${10 + i}`).reverse();
    const r = parseUpload('climate-normals', bytes('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + lines.join('\n')), 'n.csv');
    expect(r.report.ok).toBe(true);
    if (r.kind === 'climate-normals') expect(r.normals?.monthlyRainfallMm[0]).toBe(50);
  });

  it('refuses a missing month, a repeated month and a bad temperature on its line', () => {
    const lines = Array.from({ length: 11 }, (_, i) => `${i + 1},60,12`);
    expect(parseUpload('climate-normals', bytes('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + lines.join('\n')), 'n.csv').report.problems[0].message).toBe(
      'Missing month: december. Monthly normals need all 12 months.',
    );
    const rep = [...lines, '11,60,12'];
    expect(parseUpload('climate-normals', bytes('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + rep.join('\n')), 'n.csv').report.problems[0]).toMatchObject({ line: 13, column: 'month' });
    const bad = [...lines, '12,60,warm'];
    expect(parseUpload('climate-normals', bytes('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + bad.join('\n')), 'n.csv').report.problems[0]).toMatchObject({ line: 13, column: 'mean_surface_temperature_c' });
  });

  it('refuses a desert with no R0.01', () => {
    const lines = Array.from({ length: 12 }, (_, i) => `${i + 1},0,30`);
    const r = parseUpload('climate-normals', bytes('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + lines.join('\n')), 'n.csv');
    expect(r.report.ok).toBe(false);
    expect(r.report.problems[0].message).toMatch(/no R0.01/);
  });
});

describe('readCsvTable', () => {
  it('keeps blank lines out of the rows but in the line count', () => {
    const t = readCsvTable('a,b\n\n1,2\n\n3,4\n', { required: ['a', 'b'] });
    expect(t.rows.map((r) => r.line)).toEqual([3, 5]);
  });
  it('refuses a row with more cells than the header', () => {
    const t = readCsvTable('a,b\n1,2,3\n', { required: ['a', 'b'] });
    expect(t.problems[0]).toMatchObject({ line: 2 });
  });
});
