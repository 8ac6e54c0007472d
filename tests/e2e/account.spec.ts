import { readFile } from "node:fs/promises";
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";
import { storedFieldNames } from "./support/stored";

// A fresh account of its own (demo accounts are used by other specs and must stay as they are).
const email = `swift-${Date.now()}@example.com`;
const FIRST = "thermal-swift-2026";
const SECOND = "ridge-swift-2027";

async function signUp(page: Page) {
  await page.goto("/sign-up");
  await page.getByLabel("Name").fill("Swift Account");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel(/^Password/).fill(FIRST);
  await page.getByRole("button", { name: "Create account" }).click();
  // sign-up then asks for an ordinary sign-in (it reveals nothing about a taken address)
  await expect(page.getByRole("status")).toHaveText(/^Check your e-mail: we have sent a message to .*You can sign in now with the password you chose/);
  await signInAs(page, email, FIRST);
  await expect(page.getByRole("heading", { name: "Hello, Swift" })).toBeVisible();
  // the sign-in left this browser's known-device cookie (lib/auth/known-device.ts): signed, httpOnly, Lax
  const known = (await page.context().cookies()).filter((c) => c.name.startsWith("wc-known-"));
  expect(known).toEqual([expect.objectContaining({ httpOnly: true, sameSite: "Lax", path: "/" })]);
  expect(known[0]!.value).not.toContain(email);
}

/** Records a field session for the signed-in account through the sync API, as its phone would. */
async function pushSession(page: Page): Promise<string> {
  return page.evaluate(async () => {
    const me = (await (await fetch("/api/auth/session")).json()) as { user: { id: string } };
    const id = crypto.randomUUID();
    const session = { id, ownerId: me.user.id, fieldName: "Export Meadow", conditions: {}, startedAtWallMs: Date.now() };
    const res = await fetch("/api/sync/push", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ deviceId: `export-${id}`, sessions: [session], runs: [], events: [] }),
    });
    if (!res.ok) throw new Error(`push ${res.status}`);
    return id;
  });
}

async function failsToSignIn(page: Page, password: string) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("main").getByRole("alert")).toHaveText("E-mail or password is wrong.");
}

test("a pilot changes their password, exports their data, signs out everywhere and deletes the account", async ({ page, browser }) => {
  await signUp(page);
  const sessionId = await pushSession(page);

  await test.step("change the password: this browser stays signed in; the new one works, the old one does not", async () => {
    await page.goto("/settings");
    const account = page.getByRole("region", { name: "Account" });
    await expect(account).toContainText(email);
    await account.getByLabel("Current password").fill("not-my-password");
    await account.getByLabel(/^New password/).fill(SECOND);
    await account.getByRole("button", { name: "Change password" }).click();
    await expect(account.getByText("That is not your current password.")).toBeVisible();
    await account.getByLabel("Current password").fill(FIRST);
    await account.getByLabel(/^New password/).fill(SECOND);
    await account.getByRole("button", { name: "Change password" }).click();
    await expect(account.getByText("Password changed. Your other devices are signed out; this one stays signed in.")).toBeVisible();
    await page.goto("/");
    await expect(page.getByRole("heading", { name: "Hello, Swift" })).toBeVisible();
    await page.goto("/settings");
    await page.getByRole("button", { name: "Sign out", exact: true }).click();
    await expect(page).toHaveURL(/\/sign-in/);
    await failsToSignIn(page, FIRST);
    await signInAs(page, email, SECOND);
  });

  await test.step("export: a JSON download with the account's sessions", async () => {
    await page.goto("/settings");
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Download all my data (JSON)" }).click();
    const file = await (await download).path();
    const data = JSON.parse(await readFile(file, "utf8")) as { account: { email: string }; sessions: { id: string; fieldName: string }[] };
    expect(data.account.email).toBe(email);
    expect(data.sessions.map((s) => [s.id, s.fieldName])).toEqual([[sessionId, "Export Meadow"]]);
  });

  await test.step("sign out everywhere: another browser's session is signed out too", async () => {
    const other = await browser.newContext();
    const phone = await other.newPage();
    await signInAs(phone, email, SECOND);
    await page.goto("/settings");
    // the phone has pulled the account's session into its device database by now
    await expect.poll(() => storedFieldNames(page), { timeout: 20_000 }).toContain("Export Meadow");
    await page.getByRole("button", { name: "Sign every device out" }).click();
    await expect(page).toHaveURL(/\/sign-in\?signedOut=everywhere$/);
    await expect(page.getByRole("status")).toHaveText("You were signed out on every device.");
    expect(await storedFieldNames(page)).not.toContain("Export Meadow"); // cleared from this phone too
    await phone.goto("/");
    await expect(phone).toHaveURL(/\/sign-in/);
    expect(await phone.evaluate(async () => (await fetch("/api/auth/session")).json())).toEqual({});
    await other.close();
  });

  await test.step("delete the account: it can no longer sign in", async () => {
    await signInAs(page, email, SECOND);
    await page.goto("/settings");
    const account = page.getByRole("region", { name: "Account" });
    await account.getByLabel("Your password, to confirm").fill("not-my-password");
    await account.getByRole("button", { name: "Delete my account" }).click();
    await expect(account.getByText("That is not your current password.")).toBeVisible();
    await account.getByLabel("Your password, to confirm").fill(SECOND);
    await account.getByRole("button", { name: "Delete my account" }).click();
    await expect(page).toHaveURL(/\/sign-in\?deleted=1/);
    await expect(page.getByRole("status")).toHaveText("Your account was deleted.");
    await failsToSignIn(page, SECOND);
  });
});
