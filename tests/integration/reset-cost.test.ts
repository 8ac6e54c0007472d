import "./support/session";
import { afterAll, describe, expect, it, vi } from "vitest";
import { POST as resetRoute } from "@/app/api/account/reset-password/route";
import { getPool } from "./support/db";

// Counts the expensive step: an argon2id hash of the new password (lib/auth/password.ts).
const hashed = vi.hoisted(() => ({ count: 0 }));
vi.mock("@/lib/auth/password", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/auth/password")>();
  return { ...actual, hashPassword: async (p: string) => (hashed.count++, actual.hashPassword(p)) };
});

afterAll(async () => {
  await getPool().end();
});

const reset = (token: string) =>
  resetRoute(new Request("http://test/api", { method: "POST", body: JSON.stringify({ token, password: "a-new-password-1" }), headers: { "content-type": "application/json" } }));

describe("a reset link that is not valid costs the server no password hash (#9: no free CPU for strangers)", () => {
  it("answers 404 for an unknown token without hashing the new password", async () => {
    const res = await reset("x".repeat(43));
    expect(res.status).toBe(404);
    expect(hashed.count).toBe(0);
  });
});
