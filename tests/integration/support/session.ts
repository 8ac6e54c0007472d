import { vi } from "vitest";

/**
 * Route handlers read the session through next-auth's getServerSession (the season routes through the
 * cookie's token, lib/auth/session-token.ts). Integration tests replace those module boundaries (the real sign-in flow is covered end to end in tests/e2e/api-auth.spec.ts)
 * and keep everything else real: the handler, zod, Drizzle and PostgreSQL.
 */
export type MockSessionUser = { id: string; email: string; name: string; role: "member" | "admin"; sessionVersion?: number };

export const sessionState: { user: MockSessionUser | null } = {
  user: null,
};

vi.mock("next-auth", async (importOriginal) => {
  const actual = await importOriginal<typeof import("next-auth")>();
  return { ...actual, getServerSession: async () => (sessionState.user ? { user: sessionState.user, expires: "2099-01-01" } : null) };
});

// the season routes read the cookie's token without getServerSession (lib/auth/session.ts requireUserFromToken):
// the same user, as the token next-auth would have decoded (account id and session generation)
vi.mock("@/lib/auth/session-token", () => ({
  readSessionToken: async () => (sessionState.user ? { uid: sessionState.user.id, sv: sessionState.user.sessionVersion } : null),
}));

/** Acts as this user for the following requests (null = signed out). */
export function actAs(user: typeof sessionState.user): void {
  sessionState.user = user;
}
