import { NextResponse, type NextRequest } from "next/server";
import { checkWriteRequest, isGuardedWrite } from "@/lib/security/request-origin";
import { buildCsp, createNonce, HSTS, servedOverHttps } from "@/lib/security/headers";

/**
 * Runs before every page and API request (Next 16's proxy, formerly middleware). It is not the
 * sign-in boundary (each route checks the session itself); it does what no single route should
 * have to remember:
 * - refuses cross-site or non-JSON writes to /api (lib/security/request-origin.ts), before the
 *   route reads a byte of the body;
 * - gives each page a fresh CSP nonce (Next reads it from the request's policy header and puts it
 *   on its own scripts; the root layout reads `x-nonce` for the theme script);
 * - adds HSTS when served over HTTPS.
 */
export function proxy(request: NextRequest) {
  const url = request.nextUrl;
  const https = servedOverHttps(request.headers, url);
  if (url.pathname === "/api" || url.pathname.startsWith("/api/")) {
    const refusal = isGuardedWrite(request.method, url.pathname) ? checkWriteRequest(request.method, request.headers, url) : null;
    const response = refusal
      ? NextResponse.json({ error: { code: refusal.code, message: refusal.message } }, { status: refusal.status })
      : NextResponse.next();
    if (https) response.headers.set("Strict-Transport-Security", HSTS);
    return response;
  }

  const nonce = createNonce();
  const csp = buildCsp({ nonce, dev: process.env.NODE_ENV === "development", https });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("Content-Security-Policy", csp);
  if (https) response.headers.set("Strict-Transport-Security", HSTS);
  return response;
}

export const config = {
  matcher: [
    // Every API request, prefetch or not: the write guard must see them all.
    "/api/:path*",
    {
      // Everything but build assets and public files (fonts, icons, the service worker itself).
      source: "/((?!api/|_next/static|_next/image|favicon.ico|icons/|sw.js|swe-worker-|manifest.webmanifest).*)",
      // Prefetches are not rendered pages: no nonce needed (as in Next's guide).
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
