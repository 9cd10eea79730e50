import { loadSharedQuote } from '@/server/quotes/shared-quote';
import { pdfFileName, renderQuotePdf } from '@/server/quotes/pdf/render';
import { quoteReference } from '@/server/quotes/status';

const NOT_INDEXED = { 'X-Robots-Tag': 'noindex, nofollow', 'Referrer-Policy': 'no-referrer', 'Cache-Control': 'private, no-store' };

/** GET /share/:token/pdf — the customer's copy of their quote; 404 for unknown, expired and revoked links alike. */
export async function GET(_req: Request, { params }: { params: Promise<{ token: string }> }): Promise<Response> {
  const { token } = await params;
  const shared = await loadSharedQuote(token);
  if (!shared) return new Response('Not found', { status: 404, headers: NOT_INDEXED });
  const pdf = await renderQuotePdf(shared.companyId, shared.companyName, shared.quote);
  return new Response(new Uint8Array(pdf), {
    headers: { ...NOT_INDEXED, 'Content-Type': 'application/pdf', 'Content-Disposition': `inline; filename="${pdfFileName(quoteReference(shared.quote.number), shared.quote.siteName)}"` },
  });
}
