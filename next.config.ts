import type { NextConfig } from 'next';
import { apiContentSecurityPolicy, commonSecurityHeaders, transportSecurityHeaders } from './lib/api/security-headers';

const nextConfig: NextConfig = {
  // Knex loads database drivers dynamically; keep it (and pg) out of the server bundle.
  serverExternalPackages: ['knex', 'pg'],
  poweredByHeader: false,
  // A build folder of its own per working copy user when set (parallel builds must not share one).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  typedRoutes: false,
  // The type check runs once for the whole repo (`tsc --noEmit` in the test command), not again per build.
  typescript: { ignoreBuildErrors: true },
  // Pages get their Content-Security-Policy (with a nonce per request) from proxy.ts. These
  // headers are fixed when the app is built: set APP_URL before `next build` for an https site.
  async headers() {
    return [
      { source: '/:path*', headers: [...commonSecurityHeaders, ...transportSecurityHeaders(process.env.APP_URL)] },
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: apiContentSecurityPolicy }] },
    ];
  },
};

export default nextConfig;
