import { expect, test, type Page } from "@playwright/test";
import { signUpByApi } from "./support/api";
import { signInAs } from "./support/auth";

const PASSWORD = "ridge-kestrel-2026";

/** Searches /admin for `email` and returns its entry in the list of accounts found. */
async function findAccount(page: Page, email: string) {
  const users = page.getByRole("region", { name: "Users" });
  await users.getByLabel("E-mail or name").fill(email);
  await users.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(/\/admin\?q=/);
  const entry = users.getByRole("listitem", { name: email });
  await expect(entry).toBeVisible();
  return entry;
}

test("an admin finds an account, disables it (its open session ends at once), re-enables it and sees both in the audit log", async ({ page, browser, request, baseURL }) => {
  // a fresh account of its own: the demo accounts are used by other specs
  const email = await signUpByApi(request, baseURL, "Kestrel Marsh", "admin-target", PASSWORD);
  const pilotContext = await browser.newContext();
  const pilot = await pilotContext.newPage();
  await signInAs(pilot, email, PASSWORD);

  await signInAs(page, "admin@example.com");
  await page.getByRole("link", { name: "Site administration" }).click();
  await expect(page.getByRole("heading", { name: "Administration" })).toBeVisible();
  const audit = page.getByRole("region", { name: "Audit log" });

  await test.step("disable: the account shows disabled, the audit log says who did it, the pilot's next request is signed out", async () => {
    const entry = await findAccount(page, email);
    await entry.getByRole("button", { name: "Disable" }).click();
    await expect(entry.getByRole("status")).toHaveText(`Disabled ${email}.`);
    await expect(entry).toContainText("Member · Disabled");
    await expect(audit.getByRole("listitem").first()).toContainText(`Site Admin (admin@example.com) disabled ${email}`);
    await pilot.goto("/");
    await expect(pilot).toHaveURL(/\/sign-in/);
  });

  await test.step("re-enable: the pilot signs in again", async () => {
    const entry = page.getByRole("region", { name: "Users" }).getByRole("listitem", { name: email });
    await entry.getByRole("button", { name: "Re-enable" }).click();
    await expect(entry.getByRole("status")).toHaveText(`Re-enabled ${email}.`);
    await expect(entry).toContainText("Member · Active");
    await expect(audit.getByRole("listitem").first()).toContainText(`re-enabled ${email}`);
    await expect(audit.getByRole("listitem").nth(1)).toContainText(`disabled ${email}`);
    await signInAs(pilot, email, PASSWORD);
  });
  await pilotContext.close();
});

test("the admin sees the e-mail queue, retries the failed message, and sees sync rejections and clubs", async ({ page }) => {
  await signInAs(page, "admin@example.com");
  await page.goto("/admin");
  const mail = page.getByRole("region", { name: "E-mail queue" });
  const failed = mail.getByRole("listitem", { name: /^Your e-mail address was changed\b.* to lena@example\.com$/ });
  await expect(failed).toContainText("Failed, given up · 14 attempts");
  await expect(failed).toContainText("connect ECONNREFUSED");
  await failed.getByRole("button", { name: "Retry" }).click();
  await expect(failed.getByRole("status")).toHaveText("The message to lena@example.com is queued again.");
  await expect(page.getByRole("region", { name: "Audit log" }).getByRole("listitem").first()).toContainText(
    "sent the e-mail to lena@example.com again (after 14 attempts)",
  );

  await expect(page.getByRole("region", { name: "Sync rejections" })).toContainText("device demo-phone-lena · lena@example.com");
  // the demo club's five members (other specs may add more)
  await expect(page.getByRole("region", { name: "Clubs" }).getByRole("listitem").filter({ hasText: "Heronmoor Hand-Launch Club" })).toContainText(
    /(?<!\d)(?:[5-9]|[1-9]\d+) members/,
  );
});

test("a member gets the not-found page at /admin, and no admin API", async ({ page, request }) => {
  expect((await request.get("/api/admin/users")).status()).toBe(401);
  await signInAs(page, "ada@example.com");
  await expect(page.getByRole("link", { name: "Site administration" })).toHaveCount(0);
  const res = await page.goto("/admin");
  expect(res?.status()).toBe(404);
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
  await expect(page.getByText("Kestrel Marsh")).toHaveCount(0);
  const api = await page.evaluate(async () => (await fetch("/api/admin/users")).status);
  expect(api).toBe(403);
});

test("an admin turns the pages of the audit log; the other lists keep their place and the address can be shared", async ({ page, request, baseURL }) => {
  const email = await signUpByApi(request, baseURL, "Plover Reed", "admin-pages", PASSWORD);
  await signInAs(page, "admin@example.com");
  await page.goto(`/admin?q=${encodeURIComponent(email)}`);
  const found = (await (await page.request.get(`/api/admin/users?q=${encodeURIComponent(email)}`)).json()) as { users: { id: string }[] };
  const userId = found.users[0]!.id;
  // 60 admin actions on that account (disable / re-enable), through the same route the buttons use
  for (let i = 0; i < 60; i++) {
    const res = await page.request.patch(`/api/admin/users/${userId}`, { data: { action: i % 2 === 0 ? "disable" : "enable" }, headers: { origin: new URL(baseURL!).origin } });
    expect(res.status()).toBe(200);
  }
  await page.reload();
  const audit = page.getByRole("region", { name: "Audit log" });
  const entries = audit.getByRole("listitem");
  await expect(entries).toHaveCount(50);
  await expect(entries.first()).toContainText(`re-enabled ${email}`); // the 60th action, newest first
  await audit.getByRole("link", { name: "Older ›" }).click();
  await expect(page).toHaveURL(/[?&]audit=2(&|#|$)/);
  await expect(page).toHaveURL(/[?&]q=/); // the search kept
  await expect(audit.getByText("page 2")).toBeVisible();
  // page 2 starts where page 1 ended: the 10 oldest of the 60 (and whatever older the log holds)
  await expect(entries.first()).toContainText(`re-enabled ${email}`);
  await expect(audit.getByRole("link", { name: "‹ Newer" })).toBeVisible();
  const shared = page.url();
  await page.goto(shared);
  await expect(audit.getByText("page 2")).toBeVisible();
  await audit.getByRole("link", { name: "‹ Newer" }).click();
  await expect(page).not.toHaveURL(/audit=/);
  await expect(entries).toHaveCount(50);
});
