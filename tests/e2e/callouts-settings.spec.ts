import AxeBuilder from "@axe-core/playwright";
import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

test.use({ viewport: { width: 390, height: 844 } });

test("callout settings are kept on the phone and the test plays the chosen output", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/settings");
  const section = page.getByRole("region", { name: "Callouts" });
  await expect(section.getByRole("checkbox", { name: "Countdown to each target or maximum" })).toBeChecked();

  await section.getByRole("radio", { name: "Tones only" }).check();
  await section.getByRole("checkbox", { name: "Countdown to each target or maximum" }).uncheck();
  await section.getByRole("checkbox", { name: "Vibrate with each callout" }).uncheck();
  await section.getByRole("button", { name: "Test" }).click();
  await expect(section.getByRole("status")).toContainText("Played the four tones");

  await page.reload();
  await expect(section.getByRole("radio", { name: "Tones only" })).toBeChecked();
  await expect(section.getByRole("checkbox", { name: "Countdown to each target or maximum" })).not.toBeChecked();
  await expect(section.getByRole("checkbox", { name: "Vibrate with each callout" })).not.toBeChecked();
  await expect(section.getByRole("checkbox", { name: "The last 10 seconds and the end" })).toBeChecked();
  const stored = await page.evaluate(() => JSON.parse(localStorage.getItem("windowcall.callouts") ?? "null"));
  expect(stored).toMatchObject({ output: "tones", vibrate: false, groups: { targets: false, lastSeconds: true } });

  const { violations } = await new AxeBuilder({ page }).analyze();
  expect(violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => v.id)).toEqual([]);
  if (process.env.SHOTS) await page.screenshot({ path: "/tmp/settings-callouts.png", fullPage: true });
});
