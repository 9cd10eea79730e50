import { apiRoute } from '@/server/api/route';
import { listQuotes, countQuotesByStatus } from '@/db/queries/quotes';
import { quoteListQuerySchema } from '@/server/quotes/list-query';
import { expireOverdueQuotes } from '@/server/quotes/expire';

/** GET /api/v1/quotes?q=&status=&page=&pageSize= — this company's quotes, newest first, with counts per status. */
export const GET = apiRoute({ permission: 'quote.read', schema: quoteListQuerySchema }, async ({ ctx, input }) => {
  await expireOverdueQuotes(ctx.companyId);
  const [list, counts] = await Promise.all([listQuotes(ctx.companyId, input), countQuotesByStatus(ctx.companyId)]);
  return { ...list, counts };
});
