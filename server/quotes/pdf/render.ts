import 'server-only';
import { createElement } from 'react';
import { renderToBuffer } from '@react-pdf/renderer';
import { getCompanyContact, getCompanyLogo } from '@/db/queries/branding';
import { getPlanLimits } from '@/server/billing/limits';
import { quotePeople, type QuoteDetail } from '@/db/queries/quotes';
import { sellerContact, type SellerContact } from '../seller-contact';
import { QuoteDocument } from './quote-document';

/** The seller's contact printed on the quote: the company's from branding, else the quote's sender. */
async function contactFor(companyId: number, companyName: string, quoteId: number): Promise<SellerContact> {
  const [company, people] = await Promise.all([getCompanyContact(companyId), quotePeople(companyId, quoteId)]);
  return sellerContact(company ?? { name: companyName, email: null, phone: null }, people.sender ?? people.creator);
}

/** The quote's PDF bytes; the logo only when the plan includes quote branding. */
export async function renderQuotePdf(companyId: number, companyName: string, quote: QuoteDetail, now: Date = new Date(), contact?: SellerContact): Promise<Buffer> {
  const [limits, logo, seller] = await Promise.all([getPlanLimits(companyId), getCompanyLogo(companyId), contact ?? contactFor(companyId, companyName, quote.id)]);
  const element = createElement(QuoteDocument, { companyName, quote, generatedAt: now, contact: seller, logo: limits.quoteBranding && logo ? logo : null });
  // renderToBuffer's type wants a <Document> element; QuoteDocument returns exactly that.
  return renderToBuffer(element as unknown as Parameters<typeof renderToBuffer>[0]);
}

/** A file name for the download: "Q-0042-hollowmere-farm.pdf". */
export function pdfFileName(reference: string, siteName: string): string {
  const slug = siteName.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().toLowerCase().replace(/[\s_]+/g, '-').slice(0, 40);
  return `${reference}${slug ? `-${slug}` : ''}.pdf`;
}
