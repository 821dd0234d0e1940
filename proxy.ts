import { type NextRequest, NextResponse } from "next/server";
import { env } from "@/lib/env";
import { newNonce, pageContentSecurityPolicy } from "@/lib/server/security-headers";

/**
 * Gives every page request a fresh nonce and its Content-Security-Policy. The policy goes on the request
 * too: Next reads the nonce from it while rendering and puts it on its scripts — which works only for pages
 * rendered per request (the root layout awaits `connection()`). API routes get their fixed policy and
 * every response the common headers from next.config.ts.
 */
export function proxy(request: NextRequest) {
  const policy = pageContentSecurityPolicy({
    nonce: newNonce(),
    development: env.NODE_ENV === "development",
    https: new URL(env.APP_URL).protocol === "https:",
  });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return response;
}

export const config = {
  // Pages only: not API routes, build assets or the favicon.
  matcher: ["/((?!api/|_next/static/|_next/image|favicon\\.svg$).*)"],
};
