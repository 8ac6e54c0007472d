/** The user in next-auth's session answer (GET /api/auth/session), as the client pages need it. */
export type SessionUser = { id: string; name: string; email: string; role: "member" | "admin" };

/**
 * Reads next-auth's session answer: `{}` when signed out, `{ user, expires }` when signed in.
 * Anything else (a proxy's page, a half-read body) is no user. No zod here on purpose: this runs
 * in every signed-in page's first load.
 */
export function readSessionUser(body: unknown): SessionUser | null {
  if (typeof body !== "object" || body === null) return null;
  const user = (body as { user?: unknown }).user;
  if (typeof user !== "object" || user === null) return null;
  const { id, name, email, role } = user as Record<string, unknown>;
  if (typeof id !== "string" || id === "") return null;
  return {
    id,
    name: typeof name === "string" ? name : "",
    email: typeof email === "string" ? email : "",
    role: role === "admin" ? "admin" : "member",
  };
}
