import type { NextConfig } from 'next';

const nextConfig: NextConfig = {
  // Knex loads database drivers dynamically; keep it (and pg) out of the server bundle.
  serverExternalPackages: ['knex', 'pg'],
  poweredByHeader: false,
  typedRoutes: false,
};

export default nextConfig;
