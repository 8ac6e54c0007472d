import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

test("a demo pilot signs in and sees the seeded sessions", async ({ page }) => {
  // Lena flies in no other end-to-end test, and npm test seeds a fresh database for this suite,
  // so her ten newest sessions are all seeded ones (db/seed: 2–3 runs each at Five Acre Meadow).
  await signInAs(page, "lena@example.com");
  const items = page.getByRole("list", { name: "Recent sessions" }).getByRole("listitem");
  await expect(items).toHaveCount(10);
  for (const item of await items.all()) {
    await expect(item).toContainText("Five Acre Meadow");
    await expect(item).toContainText(/(?<!\d)[23] runs/);
    await expect(item).toContainText(/tasks [A-N](, [A-N])*/);
  }
});

test("a wrong password gets one generic message and no session", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("ada@example.com");
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("main").getByRole("alert")).toHaveText("E-mail or password is wrong.");
  await page.goto("/");
  await expect(page).toHaveURL(/\/sign-in$/);
});

test("a new user signs up and sees the empty state", async ({ page }) => {
  await page.goto("/sign-up");
  await page.getByLabel("Name").fill("Wren Tally");
  await page.getByLabel("E-mail").fill(`wren-${Date.now()}@example.com`);
  await page.getByLabel(/^Password/).fill("short");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByText("Use at least 10 characters.")).toBeVisible();
  await page.getByLabel(/^Password/).fill("kestrel-over-the-ridge");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByRole("heading", { name: "Hello, Wren" })).toBeVisible();
  await expect(page.getByText("No sessions yet.")).toBeVisible();
});
