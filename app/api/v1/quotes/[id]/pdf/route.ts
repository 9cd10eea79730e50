import { apiRoute } from '@/server/api/route';
import { readQuote } from '@/server/quotes/read-quote';
import { pdfFileName, renderQuotePdf } from '@/server/quotes/pdf/render';
import { quoteReference } from '@/server/quotes/status';

/** GET /api/v1/quotes/:id/pdf — the quote as a PDF with the company's name (and logo, if the plan brands quotes). */
export const GET = apiRoute<'quote.read', undefined, { id: string }>({ permission: 'quote.read' }, async ({ ctx, params }) => {
  const { quote } = await readQuote(ctx.companyId, params.id);
  const pdf = await renderQuotePdf(ctx.companyId, ctx.company.name, quote);
  return new Response(new Uint8Array(pdf), {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${pdfFileName(quoteReference(quote.number), quote.siteName)}"`,
      'Cache-Control': 'private, no-store',
    },
  });
});
