import * as quotes from '@/server/actions/quotes';
import * as shareLinks from '@/server/actions/share-links';
import * as decision from '@/server/actions/customer-decision';
import * as branding from '@/server/actions/branding';
import { GET as listQuotesRoute } from '@/app/api/v1/quotes/route';
import { GET as getQuoteRoute } from '@/app/api/v1/quotes/[id]/route';
import { GET as quotePdfRoute } from '@/app/api/v1/quotes/[id]/pdf/route';
import { GET as logoRoute } from '@/app/api/v1/branding/logo/route';
import { GET as sharedPdfRoute } from '@/app/share/[token]/pdf/route';
import { GET as sharedLogoRoute } from '@/app/share/[token]/logo/route';
import { models } from '@/db/models';
import { apiRequest, callAction } from '../support/next-request';
import { actionCase, routeCase, type CrossCompanyCase, type MatrixCase, type MatrixWorld } from '../support/action-matrix';
import { draftQuote, quoteRow, quoteTerms, sentQuote, testStudy } from '../quotes-fixtures';

/** Part B (quotes, comparison links, the customer's decision, branding) in the permission matrix. */
const ADMIN = ['admin'] as const;
const MAKERS = ['admin', 'installer'] as const;
const COMPANY = ['admin', 'installer', 'sales'] as const;
const EVERYONE = ['admin', 'installer', 'sales', 'staff', 'signed-out'] as const;

// The matrix company's plan allows 5 active links: cells that make links start from none.
async function noActiveLinks(companyId: number): Promise<void> {
  await models().ShareLink.update({ revokedAt: new Date() }, { where: { companyId, revokedAt: null } });
}
const draftIn = (w: MatrixWorld) => draftQuote(w.users.installer);
const sentIn = async (w: MatrixWorld) => {
  await noActiveLinks(w.company.id);
  return sentQuote(w.users.installer);
};
const theirDraft = (w: MatrixWorld) => draftQuote(w.otherAdmin);
const theirSent = (w: MatrixWorld) => sentQuote(w.otherAdmin);
const png = () => new File([Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAgAAAAECAIAAAA8r+mnAAAAEklEQVR4nGNgYPjPwMDAxMAAAAcgAgE1VKoPAAAAAElFTkSuQmCC', 'base64')], 'logo.png', { type: 'image/png' });
const p = (v: Record<string, string>) => v;

type Q = { quoteId: number };
type S = { quoteId: number; token: string; linkId: number };

export const cases: MatrixCase<never>[] = [
  actionCase({
    file: 'quotes', exportName: 'createQuote', action: quotes.createQuote, access: 'quote.write', allow: MAKERS,
    prepare: (w) => testStudy(w.users.installer),
    input: (_w, studyId: number) => ({ studyId, optionIndex: 1, ...quoteTerms() }),
  }),
  actionCase({ file: 'quotes', exportName: 'updateQuote', action: quotes.updateQuote, access: 'quote.write', allow: MAKERS, prepare: draftIn, input: (_w, q: Q) => ({ quoteId: q.quoteId, ...quoteTerms({ notes: 'Matrix edit' }) }) }),
  actionCase({ file: 'quotes', exportName: 'deleteQuote', action: quotes.deleteQuote, access: 'quote.write', allow: MAKERS, prepare: draftIn, input: (_w, q: Q) => ({ quoteId: q.quoteId }) }),
  actionCase({
    file: 'share-links', exportName: 'createShareLink', action: shareLinks.createShareLink, access: 'quote.share', allow: COMPANY,
    prepare: async (w) => { await noActiveLinks(w.company.id); return draftIn(w); },
    input: (_w, q: Q) => ({ quoteId: q.quoteId, expiresInDays: '7' }),
  }),
  // Any role that may share copies a colleague's active link (the installer made this one).
  actionCase({ file: 'share-links', exportName: 'copyShareLink', action: shareLinks.copyShareLink, access: 'quote.share', allow: COMPANY, prepare: sentIn, input: (_w, s: S) => ({ quoteId: s.quoteId, linkId: s.linkId }) }),
  actionCase({ file: 'share-links', exportName: 'revokeShareLink', action: shareLinks.revokeShareLink, access: 'quote.share', allow: COMPANY, prepare: sentIn, input: (_w, s: S) => ({ quoteId: s.quoteId, linkId: s.linkId }) }),
  actionCase({
    file: 'share-links', exportName: 'emailQuote', action: shareLinks.emailQuote, access: 'quote.share', allow: COMPANY,
    prepare: async (w) => { await noActiveLinks(w.company.id); return draftIn(w); },
    input: (_w, q: Q) => ({ quoteId: q.quoteId }),
  }),
  // The customer has no account: everyone passes the guard; the link token is the credential.
  actionCase({ file: 'customer-decision', exportName: 'decideQuote', action: decision.decideQuote, access: 'public', allow: EVERYONE, prepare: sentIn, input: (_w, s: S) => ({ token: s.token, decision: 'decline', name: 'Matrix Customer' }) }),
  actionCase({ file: 'branding', exportName: 'uploadLogo', action: branding.uploadLogo, access: 'branding.manage', allow: ADMIN, input: () => ({ logo: png() }) }),
  actionCase({ file: 'branding', exportName: 'saveCompanyContact', action: branding.saveCompanyContact, access: 'branding.manage', allow: ADMIN, input: () => ({ contactEmail: 'desk@matrix.example', contactPhone: '+44 1632 960 100' }) }),
  actionCase({ file: 'branding', exportName: 'removeLogo', action: branding.removeLogo, access: 'branding.manage', allow: ADMIN, input: () => ({}) }),

  routeCase({ method: 'GET', path: '/api/v1/quotes', handler: listQuotesRoute as never, access: 'quote.read', allow: COMPANY, request: () => ({ url: '/api/v1/quotes?status=open&page=1&pageSize=10' }) }),
  routeCase({ method: 'GET', path: '/api/v1/quotes/[id]', handler: getQuoteRoute as never, access: 'quote.read', allow: COMPANY, prepare: draftIn, request: (_w, q: Q) => ({ url: `/api/v1/quotes/${q.quoteId}`, params: p({ id: String(q.quoteId) }) }) }),
  routeCase({ method: 'GET', path: '/api/v1/quotes/[id]/pdf', handler: quotePdfRoute as never, access: 'quote.read', allow: COMPANY, prepare: draftIn, request: (_w, q: Q) => ({ url: `/api/v1/quotes/${q.quoteId}/pdf`, params: p({ id: String(q.quoteId) }) }) }),
  routeCase({ method: 'GET', path: '/api/v1/branding/logo', handler: logoRoute as never, access: 'quote.read', allow: COMPANY, request: () => ({ url: '/api/v1/branding/logo' }) }),
  routeCase({ method: 'GET', path: '/share/[token]/pdf', handler: sharedPdfRoute as never, access: 'public', allow: EVERYONE, prepare: sentIn, request: (_w, s: S) => ({ url: `/share/${s.token}/pdf`, params: p({ token: s.token }) }) }),
  routeCase({ method: 'GET', path: '/share/[token]/logo', handler: sharedLogoRoute as never, access: 'public', allow: EVERYONE, prepare: sentIn, request: (_w, s: S) => ({ url: `/share/${s.token}/logo`, params: p({ token: s.token }) }) }),
] as MatrixCase<never>[];

const unchangedQuote = async (quoteId: number, status: string, notes: string | null) => {
  const q = await quoteRow(quoteId);
  if (!q || q.status !== status || q.notes !== notes) throw new Error(`quote ${quoteId} changed: ${q?.status} / ${q?.notes}`);
};
const FIXTURE_NOTES = quoteTerms().notes as string;

export const crossCompany: CrossCompanyCase<never>[] = [
  { name: 'quotes#createQuote from their study', prepare: (w) => testStudy(w.otherAdmin), run: (_w, studyId: number) => callAction(quotes.createQuote, { studyId, optionIndex: 1, ...quoteTerms() }) },
  { name: 'quotes#updateQuote', prepare: theirDraft, run: (_w, q: Q) => callAction(quotes.updateQuote, { quoteId: q.quoteId, ...quoteTerms({ notes: 'Taken' }) }), unchanged: (_w, q: Q) => unchangedQuote(q.quoteId, 'draft', FIXTURE_NOTES) },
  { name: 'quotes#deleteQuote', prepare: theirDraft, run: (_w, q: Q) => callAction(quotes.deleteQuote, { quoteId: q.quoteId }), unchanged: (_w, q: Q) => unchangedQuote(q.quoteId, 'draft', FIXTURE_NOTES) },
  { name: 'share-links#createShareLink', as: 'sales', prepare: theirDraft, run: (_w, q: Q) => callAction(shareLinks.createShareLink, { quoteId: q.quoteId }), unchanged: (_w, q: Q) => unchangedQuote(q.quoteId, 'draft', FIXTURE_NOTES) },
  { name: 'share-links#emailQuote', as: 'sales', prepare: theirDraft, run: (_w, q: Q) => callAction(shareLinks.emailQuote, { quoteId: q.quoteId, to: 'thief@elsewhere.example' }), unchanged: (_w, q: Q) => unchangedQuote(q.quoteId, 'draft', FIXTURE_NOTES) },
  {
    // Their link's URL must not come back: "not found", and the answer carries no token.
    name: 'share-links#copyShareLink', as: 'sales', prepare: theirSent,
    run: async (_w, s: S) => {
      const out = await callAction(shareLinks.copyShareLink, { quoteId: s.quoteId, linkId: s.linkId });
      if (JSON.stringify(out).includes(s.token)) throw new Error('their token leaked');
      return out;
    },
  },
  {
    name: 'share-links#revokeShareLink', as: 'sales', prepare: theirSent,
    run: (_w, s: S) => callAction(shareLinks.revokeShareLink, { quoteId: s.quoteId, linkId: s.linkId }),
    unchanged: async (_w, s: S) => {
      if ((await models().ShareLink.findByPk(s.linkId))?.revokedAt) throw new Error('their link was revoked');
    },
  },
  { name: 'GET /api/v1/quotes/[id] of their quote', prepare: theirDraft, run: (_w, q: Q) => getQuoteRoute(apiRequest(`/api/v1/quotes/${q.quoteId}`), { params: Promise.resolve({ id: String(q.quoteId) }) }) },
  { name: 'GET /api/v1/quotes/[id]/pdf of their quote', prepare: theirDraft, run: (_w, q: Q) => quotePdfRoute(apiRequest(`/api/v1/quotes/${q.quoteId}/pdf`), { params: Promise.resolve({ id: String(q.quoteId) }) }) },
] as CrossCompanyCase<never>[];
