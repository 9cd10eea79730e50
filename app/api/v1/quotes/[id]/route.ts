import { apiRoute } from '@/server/api/route';
import { readQuote } from '@/server/quotes/read-quote';

/** GET /api/v1/quotes/:id — one quote with its snapshots, links (never tokens) and timeline; 404 for other companies' ids. */
export const GET = apiRoute<'quote.read', undefined, { id: string }>({ permission: 'quote.read' }, async ({ ctx, params }) => readQuote(ctx.companyId, params.id));
