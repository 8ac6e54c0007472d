import { encode } from "next-auth/jwt";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

/**
 * readSessionToken (lib/auth/session-token.ts), which the season routes use instead of getServerSession:
 * checked against tokens made by next-auth's own `encode` (the reference: what the sign-in sets), so a
 * cookie it accepts is one next-auth issued with this secret and has not expired.
 */
const jar = new Map<string, string>();
vi.mock("next/headers", () => ({ cookies: async () => ({ getAll: () => [...jar].map(([name, value]) => ({ name, value })) }) }));
const { readSessionToken } = await import("@/lib/auth/session-token");

const SECRET = "unit-test-secret-for-session-tokens-0123456789";
const COOKIE = "next-auth.session-token"; // next-auth's name over plain HTTP (NEXTAUTH_URL not https)
const claims = { uid: "0190a1b2-c3d4-7e5f-8a6b-7c8d9e0f1a2b", sv: 2 };

beforeEach(() => {
  vi.stubEnv("NEXTAUTH_SECRET", SECRET);
  vi.stubEnv("NEXTAUTH_URL", "http://localhost:3000");
  jar.clear();
});
afterEach(() => vi.unstubAllEnvs());

describe("readSessionToken", () => {
  it("decodes the session cookie next-auth issued", async () => {
    jar.set(COOKIE, await encode({ token: claims, secret: SECRET }));
    expect(await readSessionToken()).toMatchObject(claims);
  });

  it("is null without the cookie, or with the token under another name", async () => {
    expect(await readSessionToken()).toBeNull();
    jar.set("other.session-token", await encode({ token: claims, secret: SECRET }));
    expect(await readSessionToken()).toBeNull();
  });

  it("refuses a token made with another secret, a tampered one and an expired one", async () => {
    jar.set(COOKIE, await encode({ token: claims, secret: "another-secret-entirely-0123456789abcdef" }));
    expect(await readSessionToken()).toBeNull();
    const good = await encode({ token: claims, secret: SECRET });
    jar.set(COOKIE, good.slice(0, -4) + (good.endsWith("AAAA") ? "BBBB" : "AAAA"));
    expect(await readSessionToken()).toBeNull();
    // expired a minute ago (next-auth's decode allows 15 s of clock tolerance)
    jar.set(COOKIE, await encode({ token: claims, secret: SECRET, maxAge: -60 }));
    expect(await readSessionToken()).toBeNull();
  });
});
