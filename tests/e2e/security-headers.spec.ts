import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";

/**
 * Safe headers (proxy.ts, next.config.mjs): a nonce-based Content-Security-Policy with no inline
 * script allowed, never framed, no sniffing, a referrer and permissions policy, HSTS only over
 * HTTPS — with every screen still running its scripts, online and offline.
 */
test.describe.configure({ timeout: 120_000 });
test.use({ viewport: { width: 390, height: 844 } });

/** Every console error that reports a CSP violation, from now on. */
function watchCsp(page: Page): string[] {
  const violations: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" && /Content Security Policy/i.test(m.text())) violations.push(`${page.url()}: ${m.text()}`);
  });
  return violations;
}

test("pages carry the security headers, with a fresh nonce each time", async ({ request }) => {
  const first = await request.get("/sign-in");
  const second = await request.get("/sign-in");
  const csp = first.headers()["content-security-policy"]!;
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  expect(csp).toContain("frame-ancestors 'none'");
  const nonce = (h: string) => h.match(/'nonce-([^']+)'/)![1];
  expect(nonce(second.headers()["content-security-policy"]!)).not.toBe(nonce(csp));
  // The page's own scripts carry the nonce of its header.
  expect(await first.text()).toContain(`nonce="${nonce(csp)}"`);

  for (const res of [first, await request.get("/api/health"), await request.get("/sw.js")]) {
    const h = res.headers();
    expect(h["x-content-type-options"]).toBe("nosniff");
    expect(h["referrer-policy"]).toBe("strict-origin-when-cross-origin");
    expect(h["permissions-policy"]).toContain("camera=()");
    expect(h["permissions-policy"]).toContain("screen-wake-lock=(self)");
    expect(h["x-frame-options"]).toBe("DENY");
    expect(h["strict-transport-security"]).toBeUndefined(); // plain http here
  }
  const overHttps = await request.get("/sign-in", { headers: { "x-forwarded-proto": "https" } });
  expect(overHttps.headers()["strict-transport-security"]).toMatch(/^max-age=\d+/);
});

test("no screen breaks the policy, and the inline theme script runs with its nonce", async ({ page }) => {
  const violations = watchCsp(page);
  await page.goto("/sign-in");
  await page.evaluate(() => localStorage.setItem("windowcall.theme", "dark"));
  await page.reload();
  await expect(page.locator("html")).toHaveAttribute("data-theme", "dark"); // set only by the inline script
  await signInAs(page, "ada@example.com");
  await workerReady(page);

  await page.goto("/field/new");
  await page.getByLabel("Field").fill("Policy Check Field");
  await page.getByRole("radio", { name: /^A · / }).first().check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  await page.getByRole("button", { name: "Start working time" }).click();
  await page.getByRole("button", { name: /^Launch, / }).click();
  await expect(page.getByRole("button", { name: /^Landed, / })).toBeVisible();

  await page.goto("/logbook");
  await expect(page.getByRole("main")).toContainText("Policy Check Field");
  await page.goto("/settings");
  await expect(page.getByRole("radio", { name: /dark/i })).toBeChecked();

  // Offline, the precached pages keep the nonce they were fetched with, and their scripts still run.
  await page.context().setOffline(true);
  await page.goto("/logbook").catch(() => null);
  await expect(page.getByRole("main")).toContainText("Policy Check Field"); // read from IndexedDB by script
  await page.reload().catch(() => null);
  await expect(page.getByRole("main")).toContainText("Policy Check Field");
  expect(violations).toEqual([]);
});
