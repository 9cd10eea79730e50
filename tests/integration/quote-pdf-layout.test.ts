import './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { closeSequelize } from '@/db/sequelize';
import { getQuote } from '@/db/queries/quotes';
import { setCompanyContact } from '@/db/queries/branding';
import { renderQuotePdf } from '@/server/quotes/pdf/render';
import { createCompany, createUserWithRole, type TestCompany, type TestUser } from './support/factories';
import { draftQuote } from './quotes-fixtures';

/**
 * The quote PDF read back the way a person sees it: poppler's pdftotext per page (the words and
 * their order) and pdftoppm (PNG pages in .local/screenshots/pdf/ to look at). Headings must never
 * be the last thing on a page, apostrophes must survive, and a name ending in "." gets no second one.
 * Needs poppler-utils (Debian package).
 */
const HEADINGS = ['The options we compared', 'Price of the quoted option', 'Notes', 'Your contact', 'Please read'];
const SHOTS = path.resolve(__dirname, '../../.local/screenshots/pdf');
let company: TestCompany;
let installer: TestUser;
const dir = mkdtempSync(path.join(tmpdir(), 'fl-pdf-'));

const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { encoding: 'utf8' });

/** Each page's lines, without blank lines and without the fixed footer. */
function pagesOf(file: string, companyName: string): string[][] {
  const pages = Number(/Pages:\s+(\d+)/.exec(run('pdfinfo', [file]))![1]);
  return Array.from({ length: pages }, (_, i) =>
    run('pdftotext', ['-layout', '-f', String(i + 1), '-l', String(i + 1), file, '-'])
      .split('\n')
      .map((l) => l.trim())
      .filter((l) => l && !/Page \d+ of \d+/.test(l) && !l.startsWith(`${companyName} ·`)),
  );
}

beforeAll(async () => {
  company = await createCompany({ name: 'Gullwing Reef Research Buoy Co.' });
  installer = await createUserWithRole(company.id, 'installer');
  await setCompanyContact(company.id, { email: 'desk@gullwing.example', phone: '+44 1632 960 014' });
  mkdirSync(SHOTS, { recursive: true });
});
afterAll(closeSequelize);

describe('the quote PDF as printed', () => {
  it('never ends a page with a heading, whatever the length of the notes', async () => {
    const { quoteId } = await draftQuote(installer, { customerName: 'Gullwing Reef Research Buoy Co.' });
    const quote = (await getQuote(company.id, quoteId))!;
    // One more short line of notes each time moves every later heading down by a line, through
    // the foot of page 1; long notes then do the same on page 2.
    const cases = [...Array.from({ length: 18 }, (_, k) => k), 60, 75, 90];
    const endings: string[] = [];
    for (const k of cases) {
      const notes = k ? Array.from({ length: k }, (_, i) => `Line ${i + 1} of the fitting notes.`).join('\n') : null;
      const pdf = await renderQuotePdf(company.id, company.name, { ...quote, notes }, new Date('2026-12-02T10:00:00Z'));
      const file = path.join(dir, `quote-${k}.pdf`);
      writeFileSync(file, pdf);
      const pages = pagesOf(file, company.name);
      // The running footer prints on every page (react-pdf dropped it while it was anchored with `bottom`).
      pages.forEach((_, i) => expect(run('pdftotext', ['-f', String(i + 1), '-l', String(i + 1), file, '-']), `footer of page ${i + 1}, ${k} lines`).toContain(`Page ${i + 1} of ${pages.length}`));
      pages.forEach((lines, i) => endings.push(`${k} notes lines, page ${i + 1}/${pages.length}: ${lines.at(-1) ?? ''}`));
      const all = pages.flat();
      for (const h of ['The options we compared', 'Price of the quoted option', 'Your contact', 'Please read']) expect(all.filter((l) => l === h), `${h} with ${k} lines`).toHaveLength(1);
      // The price heading shares its page with the total.
      const pricePage = pages.find((p) => p.includes('Price of the quoted option'))!;
      expect(pricePage.some((l) => l.startsWith('Total'))).toBe(true);
      if (k === 0) {
        const text = all.join('\n');
        // The apostrophe is printed as ASCII 0x27, which every viewer's text layer keeps.
        expect(text).toContain("manufacturer's instructions");
        expect(text).not.toContain('Co..');
        expect(text).toContain('desk@gullwing.example');
      }
      if (k === 0 || k === 12) run('pdftoppm', ['-png', '-r', '60', file, path.join(SHOTS, `quote-notes-${k}`)]);
    }
    const lone = endings.filter((e) => HEADINGS.some((h) => e.endsWith(`: ${h}`)));
    expect(lone).toEqual([]);
    // The sweep did reach page 2 (otherwise it proved nothing about page feet).
    expect(endings.some((e) => /page 2\//.test(e))).toBe(true);
  }, 240_000);
});
