import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";
import { openNewWindow } from "./support/field";

/**
 * Accessibility of the field screens (axe-core: no serious or critical violations) in the
 * outdoor (default) and dark schemes, with a screenshot of each for review at phone size.
 */

test.use({ viewport: { width: 390, height: 844 } });

async function noSeriousViolations(page: Page, what: string) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${what}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

for (const theme of ["outdoor", "dark"] as const) {
  test(`field screens have no serious accessibility violations (${theme})`, async ({ page }, info) => {
    await page.addInitScript((t) => localStorage.setItem("windowcall.theme", t), theme);
    await signInAs(page, "ada@example.com");
    const shot = (name: string) => page.screenshot({ path: info.outputPath(`${theme}-${name}.png`), fullPage: true });

    await page.goto("/field");
    await expect(page.getByRole("heading", { name: "Before you fly" })).toBeVisible();
    await noSeriousViolations(page, "/field");
    await shot("field-first-use");
    await page.getByRole("button", { name: "I have read these" }).click();
    await expect(page.getByRole("heading", { name: "Before you fly" })).toHaveCount(0);
    await shot("field");

    await openNewWindow(page, {}); // signed in above; the field left empty on purpose
    await page.getByRole("button", { name: "Set up the window" }).click(); // empty field name: errors shown
    await expect(page.getByText("Name the field")).toBeVisible();
    await noSeriousViolations(page, "/field/new");
    await shot("new");
    await page.getByLabel("Field").fill("North Meadow");
    await page.getByRole("radio", { name: /^H · 1, 2, 3 and 4 minute/ }).check();
    await page.getByRole("button", { name: "Set up the window" }).click();
    const start = page.getByRole("button", { name: "Start working time" });
    await expect(start).toBeVisible();
    await noSeriousViolations(page, "/field/run before the start");
    await start.click();
    await page.getByRole("button", { name: /^Launch, / }).click();
    await expect(page.getByRole("button", { name: /^Landed, / })).toBeVisible();
    await page.waitForTimeout(1500);
    await page.getByRole("button", { name: /^Landed, / }).click();
    await expect(page.getByRole("button", { name: /^Launch, / })).toBeVisible();
    await page.getByRole("button", { name: /^Launch, / }).click();
    await expect(page.getByRole("button", { name: /^Landed, / })).toBeVisible();
    await noSeriousViolations(page, "/field/run working");
    await shot("run");
    await page.screenshot({ path: info.outputPath(`${theme}-run-viewport.png`) });
  });
}

test("a poker window asks for the target before the launch (F3K.11.5)", async ({ page }, info) => {
  await openNewWindow(page, { email: "ada@example.com", field: "North Meadow" });
  await page.getByRole("radio", { name: /^E · Poker.*10 min/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await page.getByRole("button", { name: "Start working time" }).click();
  const picker = page.getByRole("group", { name: /^Announced target/ });
  await expect(picker).toBeVisible();
  await picker.getByRole("button", { name: "45 seconds" }).click();
  // A target is pending: it cannot be changed until reached, so the picker goes away.
  await expect(picker).toHaveCount(0);
  await expect(page.getByText("Next target")).toBeVisible();
  await noSeriousViolations(page, "/field/run poker");
  await page.screenshot({ path: info.outputPath("outdoor-poker.png"), fullPage: true });
});
