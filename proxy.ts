import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';

/**
 * Only redirects: a signed-out visit to a signed-in page goes to /sign-in and comes back.
 * Every page, route handler and server action still checks the session itself.
 */
export async function proxy(req: NextRequest) {
  const path = req.nextUrl.pathname + req.nextUrl.search;
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  if (!token) {
    const url = req.nextUrl.clone();
    url.pathname = '/sign-in';
    url.search = `?next=${encodeURIComponent(path)}`;
    return NextResponse.redirect(url);
  }
  const headers = new Headers(req.headers);
  headers.set('x-quietfix-path', path);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ['/cases/:path*', '/admin/:path*', '/invite/:path*', '/profile/:path*', '/field/:path*', '/reports/:path*'] };
