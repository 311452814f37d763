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
  experimental: { authInterrupts: true },
  typedRoutes: false,
  // Baseline headers on every response. The script policy is left to a later, nonce-based CSP;
  // these parts cannot break the app: no framing, no plugins, forms and base URL stay on our origin.
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: "frame-ancestors 'none'; base-uri 'self'; form-action 'self'; object-src 'none'" },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=(), payment=()' },
        ],
      },
    ];
  },
};

export default nextConfig;
