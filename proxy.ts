import { NextResponse, type NextRequest } from 'next/server';
import { getEnv } from '@/server/env';
import { API_CSP, HSTS, newNonce, pageCsp, paymentFormTargets, servedOverHttps, STATIC_SECURITY_HEADERS } from '@/server/http/security-headers';
import { badPercentEncoding, checkActionBody, foreignOrigin, looksLikeAction, type Refusal } from '@/server/http/request-checks';
import { plainPage, unavailablePage } from '@/server/http/plain-pages';
import { checkDatabase } from '@/db/queries/health';
import { DB_RETRY_AFTER_SECONDS } from '@/db/unavailable';
import { SHARE_TOKEN_HEADER } from '@/server/http/share-token-header';

/**
 * Runs before every page, server action and /api request (see `config.matcher` for the paths it
 * leaves alone). In order:
 *   1. a path that does not percent-decode → 400 (Next would answer 500);
 *   2. a page POST from another site's Origin → 403; an action body over 4 MB → 413, one React
 *      cannot decode → 400 (Next's action handler answers all three 500);
 *   3. a page GET while MariaDB is out of reach → 503 with Retry-After and a page that reloads
 *      itself (the API answers its own 503 in server/api/route.ts; server actions answer a
 *      friendly ActionState in safe-action.ts);
 *   4. security headers on the answer: a CSP with a fresh nonce for pages (also put on the request,
 *      where Next reads it to stamp its own scripts), a script-free CSP for /api, HSTS over https.
 */
export async function proxy(req: NextRequest): Promise<NextResponse> {
  const env = getEnv();
  const { pathname } = req.nextUrl;
  const isApi = pathname === '/api' || pathname.startsWith('/api/');
  const https = servedOverHttps(env.APP_URL, env.TRUST_PROXY, req.headers.get('x-forwarded-proto'));
  const nonce = isApi ? null : newNonce();
  const csp = nonce
    ? pageCsp({ nonce, dev: process.env.NODE_ENV === 'development', https, formTargets: paymentFormTargets(env) })
    : API_CSP;

  const finish = (res: NextResponse): NextResponse => {
    for (const [k, v] of Object.entries(STATIC_SECURITY_HEADERS)) res.headers.set(k, v);
    res.headers.set('Content-Security-Policy', csp);
    if (https) res.headers.set('Strict-Transport-Security', HSTS);
    return res;
  };
  const refuse = (r: Refusal): NextResponse =>
    finish(
      isApi
        ? NextResponse.json({ error: { code: r.code, message: r.message } }, { status: r.status, headers: { 'Cache-Control': 'no-store' } })
        : new NextResponse(plainPage(r.status === 403 ? 'Not allowed' : 'That request could not be read', [r.message]), {
            status: r.status,
            headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store' },
          }),
    );

  if (badPercentEncoding(pathname)) return refuse({ status: 400, code: 'bad_request', message: 'The address is not valid (bad percent-encoding).' });

  const method = req.method.toUpperCase();
  const reads = method === 'GET' || method === 'HEAD';
  if (!isApi && !reads) {
    const ourHosts = [new URL(env.APP_URL).host, req.headers.get('host') ?? ''].filter(Boolean);
    if (foreignOrigin(req.headers.get('origin'), ourHosts)) return refuse({ status: 403, code: 'forbidden', message: 'This request came from another site.' });
    if (looksLikeAction(req)) {
      const refusal = await checkActionBody(req);
      if (refusal) return refuse(refusal);
    }
  }

  if (!isApi && reads) {
    const db = await checkDatabase();
    if (!db.ok) {
      return finish(
        new NextResponse(unavailablePage(DB_RETRY_AFTER_SECONDS), {
          status: 503,
          headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store', 'Retry-After': String(DB_RETRY_AFTER_SECONDS) },
        }),
      );
    }
  }

  if (!nonce) return finish(NextResponse.next());
  const requestHeaders = new Headers(req.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', csp);
  // The customer's link page: its not-found.tsx gets no params, so the token rides along in a
  // header only we set (a client's own value is dropped first).
  requestHeaders.delete(SHARE_TOKEN_HEADER);
  const shareToken = /^\/share\/([A-Za-z0-9_-]{20,128})\/?$/.exec(pathname)?.[1];
  if (shareToken) requestHeaders.set(SHARE_TOKEN_HEADER, shareToken);
  return finish(NextResponse.next({ request: { headers: requestHeaders } }));
}

export const config = {
  matcher: [
    // Everything except built assets, the payment webhook and the campaign upload. Both stream
    // their own bodies (the webhook under a 512 KB cap, a campaign file up to ~100 MB); with the
    // proxy in front, Next would first copy up to proxyClientMaxBodySize of the body and wait for
    // the whole upload (next.config.mjs gives those paths the static headers instead).
    '/((?!_next/static|_next/image|favicon.ico|api/webhooks/|api/campaign-uploads).*)',
  ],
};
