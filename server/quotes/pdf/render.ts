import 'server-only';
import { createElement } from 'react';
import { renderToBuffer } from '@react-pdf/renderer';
import { getCompanyLogo } from '@/db/queries/branding';
import { getPlanLimits } from '@/server/billing/limits';
import type { QuoteDetail } from '@/db/queries/quotes';
import { QuoteDocument } from './quote-document';

/** The quote's PDF bytes; the logo only when the plan includes quote branding. */
export async function renderQuotePdf(companyId: number, companyName: string, quote: QuoteDetail, now: Date = new Date()): Promise<Buffer> {
  const [limits, logo] = await Promise.all([getPlanLimits(companyId), getCompanyLogo(companyId)]);
  const element = createElement(QuoteDocument, { companyName, quote, generatedAt: now, logo: limits.quoteBranding && logo ? logo : null });
  // renderToBuffer's type wants a <Document> element; QuoteDocument returns exactly that.
  return renderToBuffer(element as unknown as Parameters<typeof renderToBuffer>[0]);
}

/** A file name for the download: "Q-0042-hollowmere-farm.pdf". */
export function pdfFileName(reference: string, siteName: string): string {
  const slug = siteName.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().toLowerCase().replace(/[\s_]+/g, '-').slice(0, 40);
  return `${reference}${slug ? `-${slug}` : ''}.pdf`;
}
