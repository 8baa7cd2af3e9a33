import { NextResponse, type NextRequest } from 'next/server';
import { pageContentSecurityPolicy } from '@/lib/api/security-headers';

const SESSION_COOKIE = 'needlemap_session';
const PUBLIC_PATHS = ['/sign-in'];

/**
 * Every page view: gives the page its Content-Security-Policy with a fresh nonce (Next reads the
 * nonce from the policy on the request and puts it on its scripts), and redirects signed-out views
 * to the sign-in page. The redirect is convenience only: every route handler and server action
 * authorizes the caller itself (lib/auth/authorize.ts), and the app layout sends a view whose
 * cookie names no live session to /sign-in too.
 */
export function proxy(req: NextRequest) {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
  const policy = pageContentSecurityPolicy(nonce, {
    dev: process.env.NODE_ENV === 'development',
    https: (process.env.APP_URL ?? '').startsWith('https:'),
  });
  const { pathname, search } = req.nextUrl;
  let res: NextResponse;
  if (!PUBLIC_PATHS.includes(pathname) && !req.cookies.has(SESSION_COOKIE)) {
    const url = req.nextUrl.clone();
    url.pathname = '/sign-in';
    url.search = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + search)}`;
    res = NextResponse.redirect(url);
  } else {
    const headers = new Headers(req.headers);
    headers.set('content-security-policy', policy);
    res = NextResponse.next({ request: { headers } });
  }
  res.headers.set('content-security-policy', policy);
  return res;
}

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|favicon.ico|icon.svg).*)'],
};
