import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

// The worker sends /api requests itself where page events cannot see them: block it, so every
// request the page makes is recorded.
test.use({ serviceWorkers: "block" });

test("a signed-out page calls no signed-in API; signing in starts sync", async ({ page }) => {
  const calls: string[] = [];
  page.on("request", (r) => {
    const path = new URL(r.url()).pathname;
    if (path.startsWith("/api/")) calls.push(path);
  });
  await page.goto("/sign-in");
  await expect(page.getByRole("button", { name: "Sign in" })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.waitForTimeout(1500); // a debounce or a retry timer would have fired by now
  expect(calls.filter((p) => p === "/api/time" || p.startsWith("/api/sync/"))).toEqual([]);
  await page.goto("/sign-up");
  await page.waitForLoadState("networkidle");
  expect(calls.filter((p) => p === "/api/time" || p.startsWith("/api/sync/"))).toEqual([]);

  await signInAs(page, "ada@example.com");
  await expect.poll(() => calls.filter((p) => p === "/api/time" || p.startsWith("/api/sync/")).length).toBeGreaterThan(0);
});

test("next-auth's endpoints answer odd requests with a 4xx, never a 5xx", async ({ request }) => {
  const odd = [
    request.get("/api/auth/callback/credentials"),
    request.get("/api/auth/callback/credentials?code=x&state=%00&error="),
    request.post("/api/auth/callback/credentials", { headers: { "content-type": "application/json" }, data: "{not json" }),
    request.post("/api/auth/callback/credentials", { headers: { "content-type": "application/x-www-form-urlencoded" }, data: `email=${"a".repeat(70_000)}` }),
    request.get("/api/auth/signin?callbackUrl=http%3A%2F%2F%5B"),
    request.get("/api/auth/session", { headers: { cookie: "next-auth.session-token=%%%garbage" } }),
    request.get("/api/auth/csrf", { headers: { cookie: "next-auth.callback-url=http%3A%2F%2F%5B" } }),
  ];
  for (const res of await Promise.all(odd)) expect(res.status(), `${res.url()} answered ${res.status()}`).toBeLessThan(500);
});
