import { expect, test } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { sameOrigin, signUpByApi } from "./support/api";

/**
 * Cross-site writes, open redirects and the origin in use (proxy.ts, lib/security/*): a page on
 * another site cannot make a signed-in browser write, `?next=` never leaves the site, and signing
 * out keeps to the origin the pilot is using.
 */
const PASSWORD = "origins-and-redirects";
test.use({ serviceWorkers: "block" }); // the API calls below must reach the server, not the worker

test("a cross-site text/plain POST to /api/sync/push is refused and writes nothing", async ({ page, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const email = await signUpByApi(page.request, baseURL, "Ines Varga", "xsite", PASSWORD);
    await signInAs(page, email, PASSWORD);
    const { rows } = await db.query<{ id: string }>("select id from users where email = $1", [email]);
    const userId = rows[0]!.id;
    const push = (fieldName: string) => ({
      deviceId: `xsite-${Date.now()}-${fieldName.length}`,
      sessions: [{ id: crypto.randomUUID(), ownerId: userId, fieldName, conditions: {}, startedAtWallMs: Date.now() }],
      runs: [],
      events: [],
    });
    const stored = async (sessionId: string) => (await db.query("select 1 from field_sessions where id = $1", [sessionId])).rowCount;

    // What a page on another site can send with the pilot's cookies, no preflight needed.
    const forged = push("Forged Field");
    const refused = await page.request.post("/api/sync/push", {
      headers: { origin: "http://elsewhere.example", "content-type": "text/plain" },
      data: JSON.stringify(forged),
    });
    expect(refused.status()).toBe(403);
    expect((await refused.json()).error.code).toBe("cross_origin");
    // The same from this site but not as JSON, and as JSON from another site: refused too.
    const plain = await page.request.post("/api/sync/push", { headers: { ...sameOrigin(baseURL), "content-type": "text/plain" }, data: JSON.stringify(forged) });
    expect(plain.status()).toBe(415);
    const elsewhere = await page.request.post("/api/sync/push", { headers: { origin: "http://elsewhere.example" }, data: forged });
    expect(elsewhere.status()).toBe(403);
    expect(await stored(forged.sessions[0]!.id)).toBe(0);
    expect((await db.query("select 1 from devices where id = $1", [forged.deviceId])).rowCount).toBe(0);

    // The same body sent as the app sends it is applied: the refusals were for the origin and type alone.
    const own = push("Own Field");
    const accepted = await page.request.post("/api/sync/push", { headers: sameOrigin(baseURL), data: own });
    expect(accepted.status()).toBe(200);
    expect(await stored(own.sessions[0]!.id)).toBe(1);
  } finally {
    await db.end();
  }
});

test("?next= on the sign-in form goes only to a path on this site", async ({ page, baseURL }) => {
  const email = await signUpByApi(page.request, baseURL, "Odile Park", "next", PASSWORD);
  const signIn = async (next: string) => {
    await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
  };
  for (const next of ["//elsewhere.example", "/\\elsewhere.example", "https://elsewhere.example/"]) {
    await signIn(next);
    await expect(page.getByRole("heading", { name: /^Hello,/ })).toBeVisible();
    expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
    await page.context().clearCookies();
  }
  await signIn("/logbook");
  await expect(page).toHaveURL(/\/logbook$/);
  await expect(page.getByRole("heading", { name: "Logbook" })).toBeVisible();
});

test("signing out at 127.0.0.1 stays on 127.0.0.1", async ({ page, baseURL }) => {
  const loopback = baseURL!.replace("localhost", "127.0.0.1");
  expect(loopback).not.toBe(baseURL); // the app's NEXTAUTH_URL names localhost; this browses the other name
  const email = await signUpByApi(page.request, baseURL, "Pavel Lund", "loopback", PASSWORD);
  await page.goto(`${loopback}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { name: /^Hello,/ })).toBeVisible();
  await page.goto(`${loopback}/settings`);
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(`${loopback}/sign-in`);
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  // and signed out there: the home page sends the visitor back to sign in
  await page.goto(`${loopback}/`);
  await expect(page).toHaveURL(`${loopback}/sign-in`);
});
