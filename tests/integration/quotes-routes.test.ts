import { asSignedOut, asUser, apiRequest, callAction } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { GET as listRoute } from '@/app/api/v1/quotes/route';
import { GET as detailRoute } from '@/app/api/v1/quotes/[id]/route';
import { GET as pdfRoute } from '@/app/api/v1/quotes/[id]/pdf/route';
import { GET as sharedPdfRoute } from '@/app/share/[token]/pdf/route';
import { GET as sharedLogoRoute } from '@/app/share/[token]/logo/route';
import { uploadLogo } from '@/server/actions/branding';
import { addDays, utcDay } from '@/server/quotes/status';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { draftQuote, sentQuote } from './quotes-fixtures';
import { pdfText, pdfWords } from './support/pdf-words';

let company: TestCompany;
let installer: TestUser;
let sales: TestUser;
let admin: TestUser;
let foreignInstaller: TestUser;

// Route handlers take their segment params as a promise (Next 16).
const params = <P extends Record<string, string>>(p: P) => ({ params: Promise.resolve(p) });

beforeAll(async () => {
  company = await createCompany();
  installer = await createUserWithRole(company.id, 'installer');
  sales = await createUserWithRole(company.id, 'sales');
  admin = await createUserWithRole(company.id, 'admin');
  foreignInstaller = await createUserWithRole((await createCompany()).id, 'installer');
});
afterAll(closeSequelize);
beforeEach(() => asSignedOut());

describe('GET /api/v1/quotes', () => {
  it('lists the company’s quotes with search, status filter, paging and counts; never another company’s', async () => {
    const a = await draftQuote(installer, { customerName: 'Hesketh Pellow' });
    const b = await sentQuote(installer, { customerName: 'Hesketh Pellow junior' });
    await draftQuote(foreignInstaller, { customerName: 'Hesketh Pellow abroad' });
    asUser(await signInAs(sales));
    const res = await listRoute(apiRequest('/api/v1/quotes?q=Hesketh&pageSize=1'), params({}));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.total).toBe(2);
    expect(body.pageCount).toBe(2);
    expect(body.items).toHaveLength(1);
    expect(body.items[0].id).toBe(b.quoteId);
    expect(body.items[0]).toMatchObject({ status: 'sent', activeLinks: 1, total: '342.61', chosenDishName: expect.stringContaining('90 cm') });
    expect(body.items[0]).not.toHaveProperty('options');
    expect(body.counts.sent).toBeGreaterThanOrEqual(1);

    const drafts = await (await listRoute(apiRequest('/api/v1/quotes?q=Hesketh&status=draft'), params({}))).json();
    expect(drafts.items.map((i: { id: number }) => i.id)).toEqual([a.quoteId]);
    const bad = await listRoute(apiRequest('/api/v1/quotes?status=lost'), params({}));
    expect(bad.status).toBe(422);
  });

  it('marks a sent quote past its validity as expired on read', async () => {
    const { quoteId } = await sentQuote(installer, { customerName: 'Expiring Ellery' });
    await models().Quote.update({ validUntil: addDays(utcDay(), -2) }, { where: { id: quoteId } });
    asUser(await signInAs(sales));
    const body = await (await listRoute(apiRequest('/api/v1/quotes?q=Expiring%20Ellery'), params({}))).json();
    expect(body.items[0].status).toBe('expired');
    expect((await models().Quote.findByPk(quoteId))?.status).toBe('expired');
  });

  it('needs a session', async () => {
    const res = await listRoute(apiRequest('/api/v1/quotes'), params({}));
    expect(res.status).toBe(401);
  });
});

describe('GET /api/v1/quotes/:id', () => {
  it('gives the quote with its links (no tokens) and timeline; 404 for another company or a bad id', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const foreign = await draftQuote(foreignInstaller);
    asUser(await signInAs(sales));
    const res = await detailRoute(apiRequest(`/api/v1/quotes/${quoteId}`), params({ id: String(quoteId) }));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.quote.id).toBe(quoteId);
    expect(body.quote.options.length).toBeGreaterThan(1);
    expect(body.links).toHaveLength(1);
    expect(body.links[0]).toMatchObject({ active: true, viewCount: 0 });
    expect(JSON.stringify(body)).not.toContain(token);
    expect(body.events.map((e: { kind: string }) => e.kind)).toEqual(['created', 'link_created', 'sent']);

    expect((await detailRoute(apiRequest(`/api/v1/quotes/${foreign.quoteId}`), params({ id: String(foreign.quoteId) }))).status).toBe(404);
    expect((await detailRoute(apiRequest('/api/v1/quotes/abc'), params({ id: 'abc' }))).status).toBe(404);
  });
});

describe('quote PDF', () => {
  it('is a PDF with the company name, the options and the cautions; 404 across companies', async () => {
    const { quoteId } = await draftQuote(installer, { customerName: 'Marisol Tregarthen' });
    const foreign = await draftQuote(foreignInstaller);
    asUser(await signInAs(sales));
    const res = await pdfRoute(apiRequest(`/api/v1/quotes/${quoteId}/pdf`), params({ id: String(quoteId) }));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="Q-\d{4}-long-barn-roof\.pdf"$/);
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const words = pdfWords(pdf);
    expect(words).toContain(company.name);
    expect(words).toContain('For: Marisol Tregarthen');
    expect(words).toContain('The options we compared');
    expect(words).toMatch(/Test 60 cm .* Test 90 cm .* Test 120 cm/);
    expect(words).toContain('$342.61');
    expect(words).toContain('Predictions are statistics, not guarantees');
    expect(words).toContain('Installation by qualified, licensed installers');
    expect(words).toMatch(/a year without signal/);
    expect((await pdfRoute(apiRequest(`/api/v1/quotes/${foreign.quoteId}/pdf`), params({ id: String(foreign.quoteId) }))).status).toBe(404);
  });

  it('carries the logo only when the plan includes quote branding', async () => {
    const png = Buffer.from(
      'iVBORw0KGgoAAAANSUhEUgAAAAgAAAAECAIAAAA8r+mnAAAAEklEQVR4nGNgYPjPwMDAxMAAAAcgAgE1VKoPAAAAAElFTkSuQmCC',
      'base64',
    );
    asUser(await signInAs(admin));
    const up = await callAction(uploadLogo, { logo: new File([png], 'logo.png', { type: 'image/png' }) });
    expect(up.state, JSON.stringify(up.state)).toMatchObject({ ok: true });
    const { quoteId, token } = await sentQuote(installer);
    asUser(await signInAs(sales));
    const branded = Buffer.from(await (await pdfRoute(apiRequest(`/api/v1/quotes/${quoteId}/pdf`), params({ id: String(quoteId) }))).arrayBuffer());
    expect(pdfText(branded)).toMatch(/\/Subtype \/Image/);
    const logo = await sharedLogoRoute(new Request(`http://localhost/share/${token}/logo`), params({ token }));
    expect(logo.status).toBe(200);
    expect(logo.headers.get('content-type')).toBe('image/png');

    // The same company on a plan without branding: no image, and the public logo answers 404.
    const bench = await models().Plan.findOne({ where: { code: 'bench' } });
    await models().Company.update({ planId: bench!.id }, { where: { id: company.id } });
    try {
      const plain = Buffer.from(await (await pdfRoute(apiRequest(`/api/v1/quotes/${quoteId}/pdf`), params({ id: String(quoteId) }))).arrayBuffer());
      expect(pdfText(plain)).not.toMatch(/\/Subtype \/Image/);
      expect((await sharedLogoRoute(new Request(`http://localhost/share/${token}/logo`), params({ token }))).status).toBe(404);
    } finally {
      await models().Company.update({ planId: company.planId }, { where: { id: company.id } });
    }
  });

  it('the customer’s copy opens with their link only, and is never indexed', async () => {
    const { token, linkId } = await sentQuote(installer);
    const res = await sharedPdfRoute(new Request(`http://localhost/share/${token}/pdf`), params({ token }));
    expect(res.status).toBe(200);
    expect(res.headers.get('x-robots-tag')).toBe('noindex, nofollow');
    expect(Buffer.from(await res.arrayBuffer()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await models().ShareLink.update({ revokedAt: new Date() }, { where: { id: linkId } });
    expect((await sharedPdfRoute(new Request(`http://localhost/share/${token}/pdf`), params({ token }))).status).toBe(404);
    expect((await sharedPdfRoute(new Request('http://localhost/share/nope/pdf'), params({ token: 'nope' }))).status).toBe(404);
  });
});
