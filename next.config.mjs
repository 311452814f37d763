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
};

export default nextConfig;
