/**
 * Finishing a sign-out that happened offline (lib/offline/sign-out.ts, proxy.ts).
 *
 * Signing out on a phone without signal clears the account from the phone, but next-auth's session
 * cookie is httpOnly and only the server can end it. So the phone first sets a plain cookie saying a
 * sign-out is pending, and clears it once next-auth's sign-out went through. While that cookie is
 * there, the first request that reaches the server ends the session before anything is shown: the
 * proxy answers with both cookies deleted, so no signed-in page or data is served on the old session.
 */

/** Set by the page (so not httpOnly) when a sign-out is started; cleared when next-auth's sign-out answered. */
export const PENDING_SIGN_OUT_COOKIE = "windowcall-sign-out-pending";

/** next-auth's session cookie, plain or `__Secure-` (HTTPS), whole or in chunks (`.0`, `.1`…). */
export function isSessionCookie(name: string): boolean {
  return /^(__Secure-)?next-auth\.session-token(\.\d+)?$/.test(name);
}

/**
 * What the proxy does with a request while a sign-out is pending:
 * - `"pass"`: next-auth's own sign-in and sign-out posts go through (a sign-in replaces the old
 *   session; the sign-out ends it), and the pending mark is dropped with their answer;
 * - `"retry"`: a GET or HEAD is sent again to the same address with the session cookie deleted (a
 *   redirect: the browser stores the deletion before it follows), so it is answered signed out;
 * - `"refuse"`: any other write is refused (401) with the session cookie deleted.
 */
export function pendingSignOutAction(method: string, pathname: string): "pass" | "retry" | "refuse" {
  const m = method.toUpperCase();
  if (m === "POST" && (pathname.startsWith("/api/auth/callback/") || pathname === "/api/auth/signout")) return "pass";
  return m === "GET" || m === "HEAD" ? "retry" : "refuse";
}
