/**
 * Per-request Content Security Policy for pages: a fresh nonce in the request's CSP header, from
 * which Next.js takes the nonce for its own script and style tags, and the same policy on the
 * response. This is not authorisation: every layout, page, action and handler checks for itself.
 */
import { NextResponse, type NextRequest } from 'next/server';
import { contentSecurityPolicy, newNonce } from '@/lib/csp';
import { REQUEST_PATH_HEADER } from '@/lib/workspaces/record-path';

export function proxy(request: NextRequest) {
  const nonce = newNonce();
  const policy = contentSecurityPolicy({ nonce, development: process.env.NODE_ENV === 'development' });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('content-security-policy', policy);
  // Always our own value: the not-found and forbidden pages read it to offer a switch of workspace.
  requestHeaders.set(REQUEST_PATH_HEADER, request.nextUrl.pathname);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('content-security-policy', policy);
  return response;
}

export const config = {
  matcher: [
    {
      // Pages only: the API and static files get the fixed policy from next.config.mjs. Prefetch
      // and RSC requests are pages too and get the policy like any other response.
      source: '/((?!api/|_next/static|_next/image|favicon.ico).*)',
    },
  ],
};
