import { asSignedOut, asUser, apiRequest } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { GET as pdfRoute } from '@/app/api/v1/quotes/[id]/pdf/route';
import SharedQuotePage from '@/app/share/[token]/page';
import { createStudy } from '@/server/studies/create-study';
import { createQuote } from '@/server/quotes/create-quote';
import { createShareLink } from '@/server/quotes/share';
import type { QuoteStudySnapshot } from '@/server/quotes/snapshot';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { quoteTerms, sentQuote, studyWorldOf } from './quotes-fixtures';
import { pdfWords } from './support/pdf-words';

/**
 * The quote PDF and the customer's page say truthfully where the figures come from:
 * the ITU-R maps at the site or a named company profile, gases/clouds/scintillation counted when
 * the study used the total attenuation, "rain only" for quotes made before; the statistics caution
 * stays. The words themselves are unit-tested in tests/unit/quotes/climate-words.test.ts.
 */
afterAll(closeSequelize);

// The page's decision form refreshes through the app router, which is not mounted outside Next.
vi.mock('next/navigation', async (importOriginal) => ({ ...(await importOriginal<typeof import('next/navigation')>()), useRouter: () => ({ refresh() {}, push() {}, replace() {}, back() {}, forward() {}, prefetch() {} }) }));

let company: TestCompany;
let installer: TestUser;
let sales: TestUser;
const params = <P extends Record<string, string>>(p: P) => ({ params: Promise.resolve(p) });
const actorOf = (u: TestUser) => ({ companyId: u.companyId!, user: { id: u.id, name: u.name, email: u.email } });

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  installer = await createUserWithRole(company.id, 'installer');
  sales = await createUserWithRole(company.id, 'sales');
});

/** A sent quote on a study whose rain climate came from the ITU-R maps at the site (no profile). */
async function mapsQuote(): Promise<{ quoteId: number; token: string }> {
  const w = await studyWorldOf(company.id);
  const { id: studyId } = await createStudy(
    { companyId: company.id, userId: installer.id },
    { title: 'Maps study', customer: { id: w.customerId }, site: { id: w.siteId }, serviceProfileId: w.serviceId, climateProfileId: null, dishIds: w.dishIds, targetAvailabilityPercent: 99.9 } as never,
  );
  const { id } = await createQuote(actorOf(installer), { studyId, optionIndex: 1, shownOptions: undefined, ...quoteTerms() } as never);
  const link = await createShareLink(actorOf(installer), id, 30);
  return { quoteId: id, token: link.url.split('/').pop()! };
}

async function pdfOf(quoteId: number): Promise<string> {
  asUser(await signInAs(sales));
  const res = await pdfRoute(apiRequest(`/api/v1/quotes/${quoteId}/pdf`), params({ id: String(quoteId) }));
  expect(res.status).toBe(200);
  return pdfWords(Buffer.from(await res.arrayBuffer()));
}

/** The customer's page as HTML text (entities decoded), rendered from the real page component. */
async function sharePageText(token: string): Promise<string> {
  asSignedOut();
  const html = renderToStaticMarkup(await SharedQuotePage({ params: Promise.resolve({ token }) }));
  return html.replace(/<[^>]+>/g, ' ').replace(/&#x27;/g, "'").replace(/&quot;/g, '"').replace(/&amp;/g, '&').replace(/\s+/g, ' ');
}

describe('where the figures come from, on the PDF and the customer’s page', () => {
  it('a study on the ITU-R maps: the maps at the site’s coordinates, gases, clouds and scintillation included, statistics not guarantees', async () => {
    const { quoteId, token } = await mapsQuote();
    const snap = (await models().Quote.findByPk(quoteId))!.studySnapshot as QuoteStudySnapshot;
    expect(snap.climate.kind).toBe('itu-r-maps');
    expect(snap.attenuationModel).toBe('total');

    const pdf = await pdfOf(quoteId);
    expect(pdf).toContain("Rain climate read from the ITU-R maps at your site's coordinates (ITU-R P.837-7, P.839-4).");
    expect(pdf).toContain('count rain, clouds, the gases of the air and scintillation together');
    expect(pdf).toContain('ITU-R P.618, P.676, P.837, P.838, P.839, P.840, P.841');
    expect(pdf).toContain('Predictions are statistics, not guarantees');
    expect(pdf).not.toMatch(/rain only/);

    const page = await sharePageText(token);
    expect(page).toContain("Rain climate read from the ITU-R maps at your site's coordinates (ITU-R P.837-7, P.839-4).");
    expect(page).toContain('count rain, clouds, the gases of the air and scintillation together');
    expect(page).toContain('not a guarantee for any one year');
    expect(page).toContain('Predictions are statistics, not guarantees');
    expect(page).not.toMatch(/for your location/);
  });

  it('a study on a company profile names the profile and the company that chose it', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const snap = (await models().Quote.findByPk(quoteId))!.studySnapshot as QuoteStudySnapshot;
    expect(snap.climate.kind).toBe('known-r001');
    const said = `Rain climate from “Known R0.01 (test)”, a rain rate for the area entered by ${company.name}.`;
    expect(await pdfOf(quoteId)).toContain(said);
    const page = await sharePageText(token);
    expect(page).toContain(said);
    expect(page).not.toContain('ITU-R maps at your site');
  });

  it('a quote made before the maps (no climate kind, no attenuation model in its snapshot) still says: rain only, a chosen profile', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const q = (await models().Quote.findByPk(quoteId))!;
    const { attenuationModel: _model, ...old } = q.studySnapshot as QuoteStudySnapshot;
    await models().Quote.update({ studySnapshot: { ...old, climate: { name: old.climate.name, sourceNote: old.climate.sourceNote } } }, { where: { id: quoteId } });

    const pdf = await pdfOf(quoteId);
    expect(pdf).toContain(`Rain climate from “Known R0.01 (test)”, a rain climate chosen by ${company.name}.`);
    expect(pdf).toContain('The outage figures count rain only (ITU-R P.618 rain attenuation)');
    expect(pdf).toContain('ITU-R P.618, P.837, P.838, P.839, P.841');
    expect(pdf).not.toContain('P.676');
    const page = await sharePageText(token);
    expect(page).toContain('The outage figures count rain only');
    expect(page).not.toContain('gases of the air and scintillation together');
    expect(page).toContain('Predictions are statistics, not guarantees');
  });
});
