import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";
import { openNewWindow, storedEvents } from "./support/field";

/**
 * Every form says what is wrong beside the field, in plain words (react-hook-form with the zod
 * resolver), and bad input changes nothing: no request leaves the page, no event is recorded.
 */

/** Counts the requests the page sends to `path` (any method but GET) from now on. */
function writesTo(page: Page, path: string): () => number {
  let n = 0;
  page.on("request", (r) => {
    if (r.method() !== "GET" && new URL(r.url()).pathname === path) n += 1;
  });
  return () => n;
}

test("settings: change password, delete account and a new e-mail refuse bad input beside the field, sending nothing", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/settings");
  const password = writesTo(page, "/api/account/password");
  const account = writesTo(page, "/api/account");
  const email = writesTo(page, "/api/account/email");

  const change = page.getByRole("form", { name: "Change password" });
  await change.getByLabel("Current password").fill("anything");
  await change.getByLabel(/^New password/).fill("short");
  await change.getByRole("button", { name: "Change password" }).click();
  await expect(change.getByLabel(/^New password/)).toHaveAttribute("aria-invalid", "true");
  await expect(change.getByLabel(/^New password/)).toHaveAccessibleDescription("Use at least 10 characters.");
  await expect(change.getByLabel("Current password")).not.toHaveAttribute("aria-invalid", "true");

  const del = page.getByRole("form", { name: "Delete my account" });
  await del.getByRole("button", { name: "Delete my account" }).click();
  await expect(del.getByLabel("Your password, to confirm")).toHaveAccessibleDescription("Enter your current password.");

  const move = page.getByRole("form", { name: "Change e-mail address" });
  await move.getByLabel("New e-mail address").fill("not an address");
  await move.getByRole("button", { name: "Change e-mail address" }).click();
  await expect(move.getByLabel("New e-mail address")).toHaveAccessibleDescription("Enter a valid e-mail address.");
  await expect(move.getByLabel("Your password, to change the address")).toHaveAccessibleDescription("Enter your current password.");

  expect([password(), account(), email()]).toEqual([0, 0, 0]);
  await page.reload(); // still signed in, address unchanged
  await expect(page.getByText("ada@example.com —")).toBeVisible();
});

test("forgot and reset password: the message beside the field, nothing sent", async ({ page }) => {
  const forgot = writesTo(page, "/api/account/forgot-password");
  const reset = writesTo(page, "/api/account/reset-password");
  await page.goto("/forgot-password", { waitUntil: "networkidle" });
  await page.getByLabel("E-mail").fill("no-at-sign");
  await page.getByRole("button", { name: "Send me a link" }).click();
  await expect(page.getByLabel("E-mail")).toHaveAccessibleDescription("Enter a valid e-mail address.");

  await page.goto(`/reset-password?token=${"a".repeat(43)}`, { waitUntil: "networkidle" });
  await page.getByLabel(/^New password/).fill("aaaaaaaaaaaa");
  await page.getByRole("button", { name: "Set new password" }).click();
  await expect(page.getByLabel(/^New password/)).toHaveAccessibleDescription("Use a less repetitive password.");
  expect([forgot(), reset()]).toEqual([0, 0]);
});

test("the field's penalty, flight-fix and target forms refuse bad input beside the field and record nothing", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com", field: "North Meadow" });
  await page.getByRole("radio", { name: /^H · 1, 2, 3 and 4 minute/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const runId = new URL(page.url()).searchParams.get("id")!;
  await page.getByRole("button", { name: "Start working time" }).click();
  const me = (await page.getByRole("button", { name: /^Launch, / }).getAttribute("aria-label"))!.replace(/^Launch, /, "");
  await page.getByRole("button", { name: `Launch, ${me}` }).click();
  await page.getByRole("button", { name: `Landed, ${me}` }).click();
  await expect(page.getByRole("button", { name: `Launch, ${me}` })).toBeVisible();
  const kinds = async () => (await storedEvents(page, runId)).map((e) => e.body.kind);
  const before = await kinds();

  await page.getByRole("button", { name: `Penalty… ${me}` }).click();
  const penalty = page.getByRole("form", { name: `Penalty, ${me}` });
  await penalty.getByLabel("What happened").selectOption({ label: "Something else" });
  await penalty.getByLabel("Points").fill("0");
  await penalty.getByRole("button", { name: "Add penalty" }).click();
  await expect(penalty.getByLabel("Points")).toHaveAccessibleDescription("Points are a whole number from 1 to 1000.");
  await expect(penalty.getByLabel(/^Details/)).toHaveAccessibleDescription("Say what happened.");
  await expect(penalty).toBeVisible(); // nothing added: the form stays open

  await page.getByRole("button", { name: "Fix flight 1" }).click();
  const time = page.getByLabel("Correct time of flight 1 (s)");
  await time.fill("one minute");
  await page.getByRole("button", { name: "Set time" }).click();
  await expect(time).toHaveAccessibleDescription("Type the time as seconds (63.4) or minutes:seconds (1:03.4).");

  expect(await kinds()).toEqual(before);
});

test("task E: a typed target out of range is refused beside the field and not announced", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com", field: "North Meadow" });
  await page.getByRole("radio", { name: /^E · Poker.*10 min/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const runId = new URL(page.url()).searchParams.get("id")!;
  await page.getByRole("button", { name: "Start working time" }).click();
  const picker = page.getByRole("group", { name: /^Announced target/ });
  await picker.getByLabel("Other target (s)").fill("5000");
  await picker.getByRole("button", { name: "Call", exact: true }).click();
  await expect(picker.getByLabel("Other target (s)")).toHaveAccessibleDescription("A target is a whole number of seconds, 1 to 3600.");
  expect((await storedEvents(page, runId)).map((e) => e.body.kind)).toEqual(["window-start"]);
});
