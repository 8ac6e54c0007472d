import { vi } from "vitest";

/**
 * Route handlers read the session through next-auth's getServerSession. Integration tests replace
 * that one module boundary (the real sign-in flow is covered end to end in tests/e2e/api-auth.spec.ts)
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

/** Acts as this user for the following requests (null = signed out). */
export function actAs(user: typeof sessionState.user): void {
  sessionState.user = user;
}
