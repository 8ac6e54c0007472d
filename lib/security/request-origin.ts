/**
 * Cross-site write guard for the API (checked in proxy.ts, so no route can forget it).
 *
 * A browser lets any site send a "simple" cross-site POST (text/plain, form-encoded) with the
 * user's cookies; SameSite cookies are the only other guard. Every state-changing /api request
 * must therefore say it is JSON (which a cross-site page cannot send without a CORS preflight we
 * never answer) and come from this very origin. next-auth's own endpoints (/api/auth/*) are left
 * to next-auth, which checks its own CSRF token on form posts; the payments webhook is sent by the
 * payments service, not a browser, and checks its signature instead (app/api/payments/webhook).
 */

/** Writes that come from a server, not a page of ours: each route authenticates them itself. */
const SERVER_TO_SERVER = new Set(["/api/payments/webhook"]);

/** The part of `Headers` read here. */
export type HeaderReader = Pick<Headers, "get">;

export type OriginRefusal = { status: 403 | 415; code: string; message: string };

const WRITE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** True for a request this guard applies to: a write under /api, outside next-auth's own. */
export function isGuardedWrite(method: string, pathname: string): boolean {
  if (!WRITE_METHODS.has(method.toUpperCase())) return false;
  if (pathname !== "/api" && !pathname.startsWith("/api/")) return false;
  if (SERVER_TO_SERVER.has(pathname)) return false;
  return pathname !== "/api/auth" && !pathname.startsWith("/api/auth/");
}

/**
 * The origin the request was sent to, from its own Host header (so 127.0.0.1 and localhost both
 * work) and scheme (`x-forwarded-proto` when a proxy in front terminates TLS, else the URL's).
 */
export function ownOrigin(headers: HeaderReader, url: URL): string {
  const host = headers.get("host") ?? url.host;
  const proto = headers.get("x-forwarded-proto")?.split(",")[0]?.trim() || url.protocol.replace(/:$/, "");
  return `${proto}://${host}`.toLowerCase();
}

function isJson(contentType: string | null): boolean {
  const type = contentType?.split(";")[0]?.trim().toLowerCase();
  return type === "application/json";
}

function hasBody(headers: HeaderReader): boolean {
  const length = headers.get("content-length");
  return (length !== null && length !== "0") || headers.get("transfer-encoding") !== null;
}

/**
 * Why a guarded write must be refused, or null when it may go on. Same origin means the `Origin`
 * header equals the request's own origin; a request without `Origin` passes only with
 * `Sec-Fetch-Site: same-origin` (a browser sets that header itself; scripts cannot). Then the body
 * must be JSON: POST, PUT and PATCH always, DELETE when it carries a body.
 */
export function checkWriteRequest(method: string, headers: HeaderReader, url: URL): OriginRefusal | null {
  if (!isGuardedWrite(method, url.pathname)) return null;
  const origin = headers.get("origin");
  const sameOrigin = origin
    ? origin.toLowerCase() === ownOrigin(headers, url)
    : headers.get("sec-fetch-site") === "same-origin";
  if (!sameOrigin) {
    return { status: 403, code: "cross_origin", message: "This request must come from this site's own pages." };
  }
  if ((method.toUpperCase() !== "DELETE" || hasBody(headers)) && !isJson(headers.get("content-type"))) {
    return { status: 415, code: "unsupported_media_type", message: "Send the request body as application/json." };
  }
  return null;
}
