import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";
import { openNewWindow, workerReady } from "./support/field";

/**
 * The field screens as a timekeeper uses them on a small phone: every lane's control in reach,
 * the sync badge offline, the set-up form's messages, the field remembered and suggested.
 */

test.use({ viewport: { width: 360, height: 640 } });

/** Sets up a window for `names` (one lane each) at `field`, task H, and gives the start signal (signed in as `email` first, if given). */
async function startGroupWindow(page: Page, field: string, names: string[], email?: string) {
  await openNewWindow(page, { email, field });
  if (names.length > 1) {
    await page.getByRole("radio", { name: /Several pilots/ }).check();
    for (const [i, name] of names.entries()) await page.getByLabel(`Pilot in lane ${i + 1}`).fill(name);
  }
  await page.getByRole("radio", { name: /^H · 1, 2, 3 and 4 minute/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await page.getByRole("button", { name: "Start working time" }).click();
  await expect(page.getByTestId("working-time-left")).toBeVisible();
}

/** True when the control is wholly inside the viewport and is what a finger at its middle touches (no bar over it). */
async function reachable(page: Page, name: string): Promise<boolean> {
  const control = page.getByRole("button", { name });
  return control.evaluate((el) => {
    const r = el.getBoundingClientRect();
    if (r.top < 0 || r.left < 0 || r.bottom > window.innerHeight || r.right > window.innerWidth) return false;
    const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
    return hit !== null && el.contains(hit);
  });
}

for (const lanes of [2, 3, 4]) {
  test(`${lanes} lanes: every lane's launch and landed control is in reach without scrolling on a 360×640 phone`, async ({ page }) => {
    const names = ["Kit Marsh", "Rowan Vale", "Sol Ardent", "Ivy Pell"].slice(0, lanes);
    await startGroupWindow(page, "North Meadow", names, "ada@example.com");
    await page.evaluate(() => window.scrollTo(0, 0));
    for (const [i, name] of names.entries()) {
      expect(await reachable(page, `Launch, Lane ${i + 1} · ${name}`), `lane ${i + 1} launch`).toBe(true);
    }
    // Each press flips that lane only; the controls stay in reach while pilots are in the air.
    for (const [i, name] of names.entries()) {
      await page.getByRole("button", { name: `Launch, Lane ${i + 1} · ${name}` }).click();
      await expect(page.getByRole("button", { name: `Landed, Lane ${i + 1} · ${name}` })).toBeVisible();
    }
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
    for (const [i, name] of names.entries()) {
      expect(await reachable(page, `Landed, Lane ${i + 1} · ${name}`), `lane ${i + 1} landed`).toBe(true);
    }
  });
}

test("offline, the sync badge says so and counts what waits to be sent", async ({ page, context }) => {
  await openNewWindow(page, {
    email: "ada@example.com",
    field: "North Meadow",
    offline: true, // the form is served by the worker
    beforeForm: async () => {
      await workerReady(page);
      await context.setOffline(true);
    },
  });
  await page.getByRole("radio", { name: /^H · 1, 2, 3 and 4 minute/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await page.getByRole("button", { name: "Start working time" }).click();
  await page.getByRole("button", { name: /^Launch, / }).click();
  // session, run, start signal and launch: four records on the phone, none sent
  await expect(page.getByRole("banner")).toContainText(/Offline — [1-9]\d* waiting/);
  await expect(page.getByRole("banner")).not.toContainText("Syncing");
});

test("the custom task form says what is wrong beside each field, in plain words", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com", field: "North Meadow" });
  await page.getByRole("radio", { name: /Your own task/ }).check();
  await page.getByLabel("Working time (minutes)").fill("0");
  await page.getByLabel("How many count").fill("");
  await page.getByRole("button", { name: "Set up the window" }).click();
  const working = page.getByLabel("Working time (minutes)");
  await expect(working).toHaveAttribute("aria-invalid", "true");
  await expect(working).toHaveAccessibleDescription(/minute/i);
  const count = page.getByLabel("How many count");
  await expect(count).toHaveAttribute("aria-invalid", "true");
  await expect(count).toHaveAccessibleDescription(/how many flights/i);
  // No schema wording reaches the pilot.
  await expect(page.locator("main")).not.toContainText(/Too small|Too big|expected|Invalid input|NaN/);
  // Fixed, the window is set up.
  await working.fill("10");
  await count.fill("3");
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page.getByRole("button", { name: "Start working time" })).toBeVisible();
});

test("the set-up form remembers the last field and suggests earlier ones", async ({ page }) => {
  await startGroupWindow(page, "Heather Slope", ["Ada Fenwick"], "ada@example.com");
  await startGroupWindow(page, "Windy Knoll", ["Ada Fenwick"]);
  await page.goto("/field/new");
  const field = page.getByLabel("Field", { exact: true });
  await expect(field).toHaveValue("Windy Knoll");
  // Offered as the pilot types: the phone's earlier fields, newest first (the seeded club field arrived by sync).
  const suggested = () =>
    field.evaluate((el) => Array.from((el as HTMLInputElement).list?.options ?? [], (o) => o.value));
  await expect.poll(suggested).toEqual(expect.arrayContaining(["Windy Knoll", "Heather Slope", "Five Acre Meadow"]));
  const names = await suggested();
  expect(names.indexOf("Windy Knoll")).toBeLessThan(names.indexOf("Heather Slope"));
  expect(new Set(names).size).toBe(names.length); // each field once
});

test("home's recent sessions open that session in the logbook", async ({ page }) => {
  await signInAs(page, "lena@example.com");
  const first = page.getByRole("list", { name: "Recent sessions" }).getByRole("listitem").first();
  const link = first.getByRole("link");
  await expect(link).toContainText("Five Acre Meadow");
  const date = (await first.locator("p").nth(1).innerText()).split(" · ")[0]!;
  await link.click();
  await expect(page).toHaveURL(/\/logbook\?/);
  const sessions = page.getByRole("list", { name: "Sessions" }).locator(":scope > li");
  await expect(sessions).toHaveCount(1);
  await expect(sessions.first().getByRole("heading", { level: 2 })).toHaveText(date);
  await expect(sessions.first()).toContainText("Five Acre Meadow");
});

test("sign-in and sign-up say what is wrong beside the field, in plain words", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("not-an-address");
  await page.getByLabel("Password").fill("whatever-it-is");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByLabel("E-mail")).toHaveAttribute("aria-invalid", "true");
  await expect(page.getByLabel("E-mail")).toHaveAccessibleDescription("Enter a valid e-mail address.");

  await page.goto("/sign-up");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByLabel("Name")).toHaveAccessibleDescription("Enter your name.");
  await expect(page.getByLabel("E-mail")).toHaveAccessibleDescription("Enter a valid e-mail address.");
  await expect(page.getByLabel(/^Password/)).toHaveAccessibleDescription("Use at least 10 characters.");
  await page.getByLabel(/^Password/).fill("aaaaaaaaaaaa");
  await expect(page.getByLabel(/^Password/)).toHaveAccessibleDescription("Use a less repetitive password."); // re-checked as typed
});

test("a practice plan's form ties each message to its field", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/field");
  await page.getByRole("button", { name: "New plan" }).click();
  await page.getByRole("button", { name: "Save plan" }).click();
  await expect(page.getByLabel("Plan title")).toHaveAccessibleDescription("Give the plan a title.");
  await expect(page.getByLabel("Task to add")).toHaveAccessibleDescription("Add at least one task to the plan.");
  await page.getByRole("button", { name: "Add", exact: true }).click();
  await expect(page.getByLabel("Task to add")).toHaveAccessibleDescription(""); // re-checked at once
});
