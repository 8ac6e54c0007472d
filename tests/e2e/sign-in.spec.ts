import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

test("a demo pilot signs in and sees the seeded sessions", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  const list = page.getByRole("list", { name: "Recent sessions" });
  await expect(list.getByRole("listitem")).toHaveCount(10);
  await expect(list).toContainText("Five Acre Meadow");
  // Every seeded session has 2–3 runs with their task letters (db/seed); earlier suites may add others.
  const seeded = list.getByRole("listitem").filter({ hasText: "Five Acre Meadow" });
  expect(await seeded.count()).toBeGreaterThanOrEqual(5);
  for (const item of await seeded.all()) {
    await expect(item).toContainText(/\b[23] runs/);
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
