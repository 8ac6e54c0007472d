import { expect, test, type APIRequestContext } from "@playwright/test";
import { sameOrigin } from "./support/api";
import { DEMO_PASSWORD } from "./support/auth";

/** Credentials sign-in over HTTP, as STACK.md describes (csrf, then the callback). */
async function signIn(request: APIRequestContext, email: string, password = DEMO_PASSWORD) {
  const { csrfToken } = await (await request.get("/api/auth/csrf")).json();
  return request.post("/api/auth/callback/credentials", {
    form: { csrfToken, email, password, json: "true" },
  });
}

test("an admin-only route answers 401 signed out, 403 to a pilot, 200 to an admin", async ({ playwright, baseURL }) => {
  const anon = await playwright.request.newContext({ baseURL });
  const signedOut = await anon.get("/api/admin/users");
  expect(signedOut.status()).toBe(401);
  expect((await signedOut.json()).error.code).toBe("unauthorized");

  const pilot = await playwright.request.newContext({ baseURL });
  expect((await signIn(pilot, "tobi@example.com")).ok()).toBe(true);
  const forbidden = await pilot.get("/api/admin/users");
  expect(forbidden.status()).toBe(403);

  const admin = await playwright.request.newContext({ baseURL });
  expect((await signIn(admin, "admin@example.com")).ok()).toBe(true);
  const ok = await admin.get("/api/admin/users");
  expect(ok.status()).toBe(200);
  const body = await ok.json();
  expect(body.users.map((u: { email: string }) => u.email)).toContain("ada@example.com");
  expect(JSON.stringify(body)).not.toContain("password");
});

test("a wrong password is refused with 401 and repeated failures are throttled", async ({ playwright, baseURL }) => {
  const ctx = await playwright.request.newContext({ baseURL, extraHTTPHeaders: sameOrigin(baseURL) });
  // An account of its own, so no demo pilot that other tests sign in as is slowed down.
  const email = `locked-${Date.now()}@example.com`;
  const made = await ctx.post("/api/account/sign-up", { data: { name: "Ivo Lark", email, password: "right-password-1" } });
  expect(made.status()).toBe(201);
  const wrong = await signIn(ctx, email, "wrong-password");
  expect(wrong.status()).toBe(401);
  expect((await wrong.json()).url).toContain("error=CredentialsSignin");
  for (let i = 0; i < 5; i++) await signIn(ctx, email, "wrong-password");
  // Even the right password waits while this account's gate from this address is shut; the session stays empty.
  const waiting = await signIn(ctx, email, "right-password-1");
  expect(waiting.status()).toBe(401);
  expect((await waiting.json()).url).toMatch(/error=throttled%3A\d+/);
  expect(await (await ctx.get("/api/auth/session")).json()).toEqual({});

  // Another account behind the same address is not held up by it (all loopback requests share one).
  const other = await playwright.request.newContext({ baseURL, extraHTTPHeaders: sameOrigin(baseURL) });
  const otherEmail = `neighbour-${Date.now()}@example.com`;
  expect((await other.post("/api/account/sign-up", { data: { name: "Oda Fell", email: otherEmail, password: "right-password-2" } })).status()).toBe(201);
  expect((await signIn(other, otherEmail, "right-password-2")).ok()).toBe(true);
  expect((await (await other.get("/api/auth/session")).json()).user.email).toBe(otherEmail);
});

test("sign-up rejects bad input with a clear message and creates nothing", async ({ playwright, baseURL }) => {
  const ctx = await playwright.request.newContext({ baseURL, extraHTTPHeaders: sameOrigin(baseURL) });
  const res = await ctx.post("/api/account/sign-up", { data: { name: "", email: "not-an-address", password: "x" } });
  expect(res.status()).toBe(422);
  const body = await res.json();
  expect(body.error.code).toBe("invalid_input");
  expect([...new Set(body.error.issues.map((i: { path: string }) => i.path))].sort()).toEqual(["email", "name", "password"]);
  const notJson = await ctx.post("/api/account/sign-up", { data: Buffer.from("{"), headers: { "content-type": "application/json" } });
  expect(notJson.status()).toBe(400);
});

test("health reports the database", async ({ request }) => {
  const res = await request.get("/api/health");
  expect(await res.json()).toEqual({ ok: true, database: "up" });
});
