/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: [
    '@mikro-orm/core',
    '@mikro-orm/postgresql',
    '@mikro-orm/migrations',
    '@mikro-orm/knex',
    'knex',
    'pg',
    'pino',
    'nodemailer',
    'rate-limiter-flexible',
  ],
  poweredByHeader: false,
  // `npm run bench` builds into its own folder so a bench run never replaces the build a test server is using.
  distDir: process.env.SETWELL_NEXT_DIST_DIR || '.next',
  experimental: { authInterrupts: true },
  typedRoutes: false,
  // Old page addresses, still in e-mails and bookmarks, after issue 18 renamed them (one word per thing):
  // permanent, and Next.js passes the query string on. The old "My tastings" (/tastings) is now the
  // workspace's list; app/(lab)/tastings/page.tsx sends a taster who cannot read it to /tastings/mine.
  async redirects() {
    return [
      { source: '/panels', destination: '/tastings', permanent: true },
      { source: '/panels/:path*', destination: '/tastings/:path*', permanent: true },
      { source: '/trials/:trialId/panels/:path*', destination: '/trials/:trialId/tastings/:path*', permanent: true },
    ];
  },
  // Baseline headers on every response. Pages get their full Content-Security-Policy (with a
  // per-request script nonce) from proxy.ts; the API and downloads keep the baseline policy.
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=(), payment=()' },
        ],
      },
      {
        source: '/api/:path*',
        headers: [{ key: 'Content-Security-Policy', value: "frame-ancestors 'none'; base-uri 'self'; form-action 'self'; object-src 'none'" }],
      },
    ];
  },
};

export default nextConfig;
