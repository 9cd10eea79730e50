/**
 * The security headers of every response, in one place (proxy.ts sets them; next.config.mjs sets
 * the same static ones on the few paths the proxy leaves alone). Pure: no Next, no environment
 * reads — callers pass what they know.
 */

/**
 * Headers that do not depend on the request. No page may be framed (the customer's accept page
 * least of all); browsers must not guess content types; no page leaks its URL in a Referer (share,
 * reset and invitation links carry a live token in the path, so the strictest policy is simplest
 * everywhere); features we do not use are off, and geolocation is ours only (the site form
 * offers "use my location").
 */
export const STATIC_SECURITY_HEADERS: Readonly<Record<string, string>> = {
  'X-Frame-Options': 'DENY',
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'no-referrer',
  'Permissions-Policy': 'geolocation=(self), camera=(), microphone=(), payment=(), usb=(), serial=(), hid=(), bluetooth=(), browsing-topics=()',
  'Cross-Origin-Opener-Policy': 'same-origin',
};

/** JSON and files need no script, style or frame at all. */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** One year, as the HSTS preload list asks; only ever sent over https. */
export const HSTS = 'max-age=31536000; includeSubDomains';

export type PageCspOptions = {
  nonce: string;
  /** next dev needs eval (React's error overlay) and a websocket for hot reload. */
  dev: boolean;
  /** Served over https: also upgrade any stray http sub-request. */
  https: boolean;
  /** Where a form may post to or be redirected to after posting, besides ourselves (the payment provider's checkout and portal). */
  formTargets: string[];
};

/**
 * The page policy. Scripts run only with this request's nonce ('strict-dynamic' lets Next's
 * nonce-bearing loader pull in its chunks); Next puts the nonce on its own scripts and inline
 * <style> when it finds it in the request's CSP header. Style *attributes* stay allowed
 * (style-src-attr): they cannot run code, and server-rendered React output uses a few.
 */
export function pageCsp(o: PageCspOptions): string {
  const nonce = `'nonce-${o.nonce}'`;
  const directives = [
    "default-src 'self'",
    `script-src 'self' ${nonce} 'strict-dynamic'${o.dev ? " 'unsafe-eval'" : ''}`,
    `style-src 'self' ${o.dev ? "'unsafe-inline'" : nonce}`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${o.dev ? ' ws: wss:' : ''}`,
    "object-src 'none'",
    "base-uri 'none'",
    `form-action 'self'${o.formTargets.length ? ' ' + o.formTargets.join(' ') : ''}`,
    "frame-ancestors 'none'",
    "frame-src 'none'",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
  ];
  if (o.https) directives.push('upgrade-insecure-requests');
  return directives.join('; ');
}

/** 16 random bytes, base64: unguessable and fresh for every request. */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * Whether this request reached us over https: the configured public URL says so, or — only when
 * a proxy of ours sets it (TRUST_PROXY) — X-Forwarded-Proto does. A client's own header is not
 * believed otherwise.
 */
export function servedOverHttps(appUrl: string, trustProxy: boolean, forwardedProto: string | null): boolean {
  if (appUrl.startsWith('https:')) return true;
  if (!trustProxy || !forwardedProto) return false;
  // A chain of proxies appends: the last value is the one our proxy wrote.
  return forwardedProto.split(',').at(-1)?.trim().toLowerCase() === 'https';
}

/**
 * Origins the payment provider sends the customer to after a form posts (checkout, billing
 * portal). With the local payments fake (STRIPE_API_HOST set) that is the fake itself.
 */
export function paymentFormTargets(env: { STRIPE_API_HOST?: string; STRIPE_API_PORT?: number; STRIPE_API_PROTOCOL?: string }): string[] {
  if (env.STRIPE_API_HOST) {
    const proto = env.STRIPE_API_PROTOCOL ?? 'https';
    return [`${proto}://${env.STRIPE_API_HOST}${env.STRIPE_API_PORT ? `:${env.STRIPE_API_PORT}` : ''}`];
  }
  return ['https://checkout.stripe.com', 'https://billing.stripe.com'];
}
