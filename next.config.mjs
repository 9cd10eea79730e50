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
  async headers() {
    const tokenPage = [
      { key: 'X-Robots-Tag', value: 'noindex, nofollow' },
      { key: 'Referrer-Policy', value: 'no-referrer' },
    ];
    return ['/share/:path*', '/reset-password/:path*', '/invite/:path*', '/sign-up/confirm/:path*'].map((source) => ({ source, headers: tokenPage }));
  },
  experimental: { serverActions: { bodySizeLimit: '4mb' } },
};

export default nextConfig;
