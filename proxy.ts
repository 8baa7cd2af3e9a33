import { NextResponse, type NextRequest } from 'next/server';

const SESSION_COOKIE = 'needlemap_session';
const PUBLIC_PATHS = ['/sign-in'];

/**
 * Redirects signed-out page views to the sign-in page. This is convenience only: every route
 * handler and server action authorizes the caller itself (lib/auth/authorize.ts).
 */
export function proxy(req: NextRequest) {
  const { pathname, search } = req.nextUrl;
  if (PUBLIC_PATHS.includes(pathname)) return NextResponse.next();
  if (!req.cookies.has(SESSION_COOKIE)) {
    const url = req.nextUrl.clone();
    url.pathname = '/sign-in';
    url.search = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + search)}`;
    return NextResponse.redirect(url);
  }
  return NextResponse.next();
}

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|favicon.ico|icon.svg).*)'],
};
