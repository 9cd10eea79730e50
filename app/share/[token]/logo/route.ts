import { getCompanyLogo } from '@/db/queries/branding';
import { sharedLogoCompany } from '@/server/quotes/shared-quote';

const NOT_INDEXED = { 'X-Robots-Tag': 'noindex, nofollow', 'Referrer-Policy': 'no-referrer', 'Cache-Control': 'private, no-store' };

/** GET /share/:token/logo — the logo of the company whose open link this is (no account; 404 otherwise). */
export async function GET(_req: Request, { params }: { params: Promise<{ token: string }> }): Promise<Response> {
  const { token } = await params;
  const companyId = await sharedLogoCompany(token);
  const logo = companyId ? await getCompanyLogo(companyId) : null;
  if (!logo) return new Response('Not found', { status: 404, headers: NOT_INDEXED });
  return new Response(new Uint8Array(logo.data), { headers: { ...NOT_INDEXED, 'Content-Type': logo.mime, 'X-Content-Type-Options': 'nosniff' } });
}
