/**
 * Security headers. The ones every response carries are set in next.config.ts; the page policy
 * needs a fresh nonce per request and is set by proxy.ts; API answers get a policy of their own.
 * Plain data and string building: next.config.ts loads this file, so it imports nothing.
 */

/** Headers on every response: pages, API answers, static files. */
export const commonSecurityHeaders: { key: string; value: string }[] = [
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  // Nothing in the app uses these; no page of ours, nor anything injected into one, may ask for them.
  {
    key: 'Permissions-Policy',
    value: 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), hid=(), display-capture=(), browsing-topics=()',
  },
  // frame-ancestors says the same to browsers that read it; this is for those that do not.
  { key: 'X-Frame-Options', value: 'DENY' },
];

/**
 * Strict-Transport-Security, for a deployment served over https only (APP_URL starts with https:).
 * A year, subdomains included (the usual value, as OWASP's HSTS cheat sheet gives it; from memory); over plain http (the demo, the tests) browsers ignore it anyway,
 * so it is left out there rather than promised.
 */
export function transportSecurityHeaders(appUrl: string | undefined): { key: string; value: string }[] {
  return (appUrl ?? '').startsWith('https:')
    ? [{ key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' }]
    : [];
}

/**
 * The policy of API answers: JSON, uploaded files, exports. None of them is a page that should run
 * or load anything, so an uploaded SVG or HTML-looking file opened on its own stays inert.
 */
export const apiContentSecurityPolicy = "default-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

/**
 * The policy of pages, with the request's nonce. Next puts the nonce on its own scripts (it reads
 * it from this header on the request, see proxy.ts); 'strict-dynamic' lets those scripts load the
 * page's chunks, and no other script runs. Styles allow 'unsafe-inline' because React writes
 * style attributes (zone colours, bar widths, the body-map stage) that a nonce cannot cover; a style
 * cannot run code. Images may be blob: and data: URLs: pattern tiles, upload previews and canvas
 * snapshots are made in the browser. `dev` adds 'unsafe-eval', which React's development build
 * needs for its error overlay; `https` asks the browser to fetch nothing over plain http.
 */
export function pageContentSecurityPolicy(nonce: string, opts: { dev: boolean; https: boolean }): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(opts.https ? ['upgrade-insecure-requests'] : []),
  ].join('; ');
}
