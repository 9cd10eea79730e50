import { apiRoute } from '@/server/api/route';
import { getCompanyLogo } from '@/db/queries/branding';
import { NotFoundError } from '@/server/errors';

/** GET /api/v1/branding/logo — the signed-in company's quote logo (for its own pages). */
export const GET = apiRoute({ permission: 'quote.read' }, async ({ ctx }) => {
  const logo = await getCompanyLogo(ctx.companyId);
  if (!logo) throw new NotFoundError('The logo');
  return new Response(new Uint8Array(logo.data), { headers: { 'Content-Type': logo.mime, 'Cache-Control': 'private, max-age=60', 'X-Content-Type-Options': 'nosniff' } });
});
