/**
 * The security headers of every page (proxy.ts sets them per request; next.config.mjs adds the
 * static ones to every response, assets and the service worker included).
 */

/** A fresh, unguessable nonce for one response (base64 of 16 random bytes). */
export function createNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

export type CspOptions = { nonce: string; dev: boolean; https: boolean; /** Object storage the browser uploads to with presigned URLs (S3_ENDPOINT). */ storage?: string };

/** The origin of an object-storage URL, or null when it is not an http(s) URL. */
export function storageOrigin(url: string | undefined): string | null {
  if (!url) return null;
  try {
    const u = new URL(url);
    return u.protocol === "http:" || u.protocol === "https:" ? u.origin : null;
  } catch {
    return null;
  }
}

/**
 * A nonce-based Content-Security-Policy as in Next's own guide: scripts run only with this
 * response's nonce, and what they load ('strict-dynamic'); no inline script in production (dev
 * needs 'unsafe-eval' for its overlay). Styles allow inline `style` attributes (the clock bar and
 * breakdown widths), which a nonce cannot cover. The worker is named (worker-src) because
 * 'strict-dynamic' makes script-src ignore 'self'. Never framed by anyone.
 */
export function buildCsp({ nonce, dev, https, storage }: CspOptions): string {
  const storageSrc = storageOrigin(storage);
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    `connect-src 'self'${storageSrc ? ` ${storageSrc}` : ""}`,
    "worker-src 'self'",
    "manifest-src 'self'",
    "media-src 'self' blob: data:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ];
  // Only over HTTPS: on plain http (loopback, a field laptop) it would send same-origin requests to https.
  if (https) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/** HSTS for responses served over HTTPS (directly or behind a proxy that says so); none on http. */
export const HSTS = "max-age=63072000; includeSubDomains";

/** True when the request reached us over HTTPS, by its URL or the proxy's `x-forwarded-proto`. */
export function servedOverHttps(headers: Pick<Headers, "get">, url: URL): boolean {
  const forwarded = headers.get("x-forwarded-proto")?.split(",")[0]?.trim().toLowerCase();
  return forwarded ? forwarded === "https" : url.protocol === "https:";
}
