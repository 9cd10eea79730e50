import { asSignedOut, asUser, apiRequest } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { closeSequelize } from '@/db/sequelize';
import { getStudy } from '@/db/queries/studies';
import { GET as pdfRoute } from '@/app/api/v1/quotes/[id]/pdf/route';
import SharedQuotePage from '@/app/share/[token]/page';
import StudyPage from '@/app/(app)/studies/[id]/page';
import { createStudy } from '@/server/studies/create-study';
import { createQuote } from '@/server/quotes/create-quote';
import { createShareLink } from '@/server/quotes/share';
import { readStudyOption } from '@/server/study-option';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { quoteTerms, studyWorldOf } from './quotes-fixtures';
import { pdfWords } from './support/pdf-words';

/**
 * One stored study, three renderings: the study page the installer reads, the PDF and the
 * customer's page. For every option they must give the same availability and the same outage
 * (server/study-option decides both once). The figures are compared between the renderings
 * themselves, not only with the read model, so a renderer that formats on its own is caught.
 */
afterAll(closeSequelize);

// Client parts of the pages refresh through the app router, which is not mounted outside Next.
vi.mock('next/navigation', async (importOriginal) => ({ ...(await importOriginal<typeof import('next/navigation')>()), useRouter: () => ({ refresh() {}, push() {}, replace() {}, back() {}, forward() {}, prefetch() {} }), usePathname: () => '/' }));

let company: TestCompany;
let installer: TestUser;
const actorOf = (u: TestUser) => ({ companyId: u.companyId!, user: { id: u.id, name: u.name, email: u.email } });
const params = <P extends Record<string, string>>(p: P) => ({ params: Promise.resolve(p) });

/** Markup as the text a person reads: tags to spaces, entities decoded, spaces collapsed. */
const text = (html: string) => html.replace(/<[^>]+>/g, ' ').replace(/&#x27;/g, "'").replace(/&quot;/g, '"').replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/\s+/g, ' ');

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  installer = await createUserWithRole(company.id, 'installer');
});

/** The rows of the study's "Trade-off per dish" table, as text, in the study's order. */
function studyTableRows(html: string): string[] {
  const table = html.slice(html.indexOf('Trade-off per dish'));
  // One <tbody> per dish: its figures row (the one with the row header), then its link-budget line.
  const body = table.slice(table.indexOf('<tbody'), table.indexOf('</table>'));
  return body.split('<tr').slice(1).filter((row) => row.includes('scope="row"')).map(text);
}

/** "99.951" from "99.951 %", "> 99.999 %", "at least 99.950 %". */
const availabilityIn = (s: string) => s.match(/(\d{2,3}\.\d{3}) %/)?.[1] ?? null;
/** "4.3 hour" from "4.3 h" or "4.3 hours", "45 minute" from "45 min" / "45 minutes". */
const durationIn = (s: string) => {
  const m = s.match(/(\d[\d,.]*) (h|hours?|min|minutes?|d|days?)\b/);
  if (!m) return null;
  const unit = m[2].startsWith('h') ? 'hour' : m[2].startsWith('m') ? 'minute' : 'day';
  return `${m[1]} ${unit}`;
};

describe('the same option reads the same on the study page, the PDF and the customer’s page', () => {
  it('availability and outage agree word for word, option by option', async () => {
    const w = await studyWorldOf(company.id);
    const { id: studyId } = await createStudy(
      { companyId: company.id, userId: installer.id },
      { title: 'Three renderings', customer: { id: w.customerId }, site: { id: w.siteId }, serviceProfileId: w.serviceId, climateProfileId: null, dishIds: w.dishIds, targetAvailabilityPercent: 99.9 } as never,
    );
    const study = (await getStudy(company.id, studyId))!;
    const t = study.result.tradeoff;
    const shown = t.options.map((_, i) => i);
    const { id: quoteId } = await createQuote(actorOf(installer), { studyId, optionIndex: 1, shownOptions: shown, ...quoteTerms() } as never);
    const token = (await createShareLink(actorOf(installer), quoteId, 30)).url.split('/').pop()!;

    asUser(await signInAs(installer));
    const studyHtml = renderToStaticMarkup(await StudyPage(params({ id: String(studyId) })));
    const res = await pdfRoute(apiRequest(`/api/v1/quotes/${quoteId}/pdf`), params({ id: String(quoteId) }));
    expect(res.status).toBe(200);
    const pdf = pdfWords(Buffer.from(await res.arrayBuffer()));
    asSignedOut();
    const page = text(renderToStaticMarkup(await SharedQuotePage(params({ token }))));

    const rows = studyTableRows(studyHtml);
    expect(rows).toHaveLength(t.options.length);
    let compared = 0;
    for (const [i, row] of rows.entries()) {
      const reading = readStudyOption(t, i);
      if (!reading.closes) continue;
      compared++;
      const name = study.inputs.dishes[i].name;

      // The study table: availability cell, minutes, and the same figure in hours below it.
      expect(row).toContain(reading.availability.text);
      expect(row).toContain(reading.outage.minutesText);
      expect(row).toContain(reading.outage.durationText);

      // The PDF: the option's row holds its year and worst-month words, then its availability.
      const pdfRow = pdf.slice(pdf.indexOf(`${name} ${reading.diameter.words}`));
      expect(pdfRow.startsWith(name)).toBe(true);
      expect(pdfRow).toContain(`${reading.outage.yearWords} ${reading.worstMonth.words} ${reading.availability.text}`);

      // The customer's page: the option's card.
      const card = page.slice(page.indexOf(`${name} ${reading.diameter.words} dish`));
      expect(card.startsWith(name)).toBe(true);
      expect(card).toContain(`${reading.outage.yearWords} ${reading.worstMonth.words} Signal available ${reading.availability.words}.`);

      // And between the renderings themselves: one availability figure, one outage duration.
      const availability = availabilityIn(row);
      expect(availability).not.toBeNull();
      expect(availabilityIn(pdfRow)).toBe(availability);
      expect(availabilityIn(card)).toBe(availability);
      const tableDuration = durationIn(row.slice(row.indexOf(reading.outage.durationText)));
      expect(durationIn(reading.outage.yearWords)).toBe(tableDuration);
      expect(durationIn(pdfRow.slice(name.length))).toBe(tableDuration);
      expect(durationIn(card.slice(card.indexOf(reading.outage.yearWords)))).toBe(tableDuration);
    }
    expect(compared).toBeGreaterThanOrEqual(2);
    // The cautions stay beside the figures everywhere.
    expect(pdf).toContain('predictions are statistics, not guarantees');
    expect(page).toContain('not a guarantee for any one year');
  });
});
