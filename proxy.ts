import { NextResponse, type NextRequest } from "next/server";
import { checkWriteRequest, isGuardedWrite } from "@/lib/security/request-origin";
import { buildCsp, createNonce, HSTS, servedOverHttps } from "@/lib/security/headers";
import { isSessionCookie, PENDING_SIGN_OUT_COOKIE, pendingSignOutAction } from "@/lib/security/pending-sign-out";

/**
 * Runs before every page and API request (Next 16's proxy, formerly middleware). It is not the
 * sign-in boundary (each route checks the session itself); it does what no single route should
 * have to remember:
 * - refuses cross-site or non-JSON writes to /api (lib/security/request-origin.ts), before the
 *   route reads a byte of the body;
 * - gives each page a fresh CSP nonce (Next reads it from the request's policy header and puts it
 *   on its own scripts; the root layout reads `x-nonce` for the theme script);
 * - adds HSTS when served over HTTPS;
 * - finishes a sign-out started offline (lib/security/pending-sign-out.ts) before anything is served.
 */
export function proxy(request: NextRequest) {
  const url = request.nextUrl;
  const https = servedOverHttps(request.headers, url);
  if (request.cookies.has(PENDING_SIGN_OUT_COOKIE)) return finishSignOut(request);
  if (url.pathname === "/api" || url.pathname.startsWith("/api/")) {
    const refusal = isGuardedWrite(request.method, url.pathname) ? checkWriteRequest(request.method, request.headers, url) : null;
    const response = refusal
      ? NextResponse.json({ error: { code: refusal.code, message: refusal.message } }, { status: refusal.status })
      : NextResponse.next();
    if (https) response.headers.set("Strict-Transport-Security", HSTS);
    return response;
  }

  const nonce = createNonce();
  const csp = buildCsp({ nonce, dev: process.env.NODE_ENV === "development", https, storage: process.env.S3_ENDPOINT });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("Content-Security-Policy", csp);
  if (https) response.headers.set("Strict-Transport-Security", HSTS);
  return response;
}

/** A request while a sign-out is pending: end the session (delete its cookie) before serving anything. */
function finishSignOut(request: NextRequest): NextResponse {
  const action = pendingSignOutAction(request.method, request.nextUrl.pathname);
  const response =
    action === "pass"
      ? NextResponse.next()
      : action === "retry"
        ? NextResponse.redirect(request.nextUrl, 307)
        : NextResponse.json({ error: { code: "unauthorized", message: "Signed out. Sign in again." } }, { status: 401 });
  response.headers.set("cache-control", "no-store");
  response.cookies.set(PENDING_SIGN_OUT_COOKIE, "", { path: "/", maxAge: 0 });
  if (action === "pass") return response;
  for (const { name } of request.cookies.getAll()) {
    if (isSessionCookie(name)) response.cookies.set(name, "", { path: "/", maxAge: 0, httpOnly: true, sameSite: "lax", secure: name.startsWith("__Secure-") });
  }
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
