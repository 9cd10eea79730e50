/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads dialect modules dynamically (pg-hstore…), and argon2 is a native addon:
  // bundling either breaks the build, so they stay plain Node requires.
  serverExternalPackages: ['sequelize', 'mariadb', '@node-rs/argon2', 'nodemailer', '@react-pdf/renderer'],
  poweredByHeader: false,
  // The build type-checks the app only; `npm test` type-checks everything (tests included) with tsc.
  typescript: { tsconfigPath: 'tsconfig.build.json' },
  typedRoutes: false,
  // Pages reached by an unguessable link carry the token in their path: never index them, never
  // leak the token in a Referer header.
  // proxy.ts sets the security headers (CSP with a per-request nonce, HSTS over https) on every
  // page and /api answer; the static ones are repeated here for what it does not see (built assets,
  // the payment webhook). Keep them equal to server/http/security-headers.ts.
  async headers() {
    const tokenPage = [
      { key: 'X-Robots-Tag', value: 'noindex, nofollow' },
      { key: 'Referrer-Policy', value: 'no-referrer' },
    ];
    const everywhere = [
      { key: 'X-Content-Type-Options', value: 'nosniff' },
      { key: 'X-Frame-Options', value: 'DENY' },
      { key: 'Referrer-Policy', value: 'no-referrer' },
    ];
    const webhook = [{ key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'" }];
    return [
      { source: '/_next/static/:path*', headers: everywhere },
      { source: '/api/webhooks/:path*', headers: [...everywhere, ...webhook] },
      { source: '/api/campaign-uploads', headers: [...everywhere, ...webhook] },
      ...['/share/:path*', '/reset-password/:path*', '/invite/:path*', '/sign-up/confirm/:path*', '/unlock/:path*'].map((source) => ({ source, headers: tokenPage })),
    ];
  },
  experimental: {
    // forbidden() and app/forbidden.tsx: a signed-in person without the permission for a page gets
    // a 403 that names their role (server/auth/guards.ts requirePermission), not a 404.
    authInterrupts: true,
    // Keep equal to ACTION_BODY_LIMIT_BYTES in server/http/request-checks.ts (proxy.ts answers 413 above it).
    serverActions: { bodySizeLimit: '4mb' },
    // What Next copies of a request body for proxy.ts. Above the 4 MB action limit, so the proxy
    // sees that a body went over it (a copy cut at exactly 4 MB would look complete).
    proxyClientMaxBodySize: '5mb',
  },
};

export default nextConfig;
