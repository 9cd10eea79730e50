/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads dialect modules dynamically (pg-hstore…), and argon2 is a native addon:
  // bundling either breaks the build, so they stay plain Node requires.
  serverExternalPackages: ['sequelize', 'mariadb', '@node-rs/argon2', 'nodemailer', '@react-pdf/renderer'],
  poweredByHeader: false,
  // The build type-checks the app only; `npm test` type-checks everything (tests included) with tsc.
  typescript: { tsconfigPath: 'tsconfig.build.json' },
  typedRoutes: false,
  // The customer's comparison page is reached by an unguessable link: never index it, never leak it in Referer.
  async headers() {
    return [
      {
        source: '/share/:path*',
        headers: [
          { key: 'X-Robots-Tag', value: 'noindex, nofollow' },
          { key: 'Referrer-Policy', value: 'no-referrer' },
        ],
      },
    ];
  },
  experimental: { serverActions: { bodySizeLimit: '4mb' } },
};

export default nextConfig;
