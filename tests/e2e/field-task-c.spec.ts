import { expect, test } from "@playwright/test";
import { openNewWindow, press, settle } from "./support/field";

/** Task C (F3K.11.3): one launch signal per attempt, each attempt with its own 3:33 deadline. */
const T0 = new Date("2026-05-02T09:00:00Z");
test.use({ viewport: { width: 390, height: 844 } });
test.describe.configure({ timeout: 150_000 });

test("task C gives the next attempt's signal once an attempt is over", async ({ page }) => {
  await openNewWindow(page, { email: "tobi@example.com", t0: T0, field: "North Meadow" });
  await page.getByRole("radio", { name: /^C · All up, last down · 3 attempts/ }).check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const start = page.getByRole("button", { name: "Start working time" });
  await settle(page, start);
  await press(page, start);
  await settle(page, page.getByText("Attempt 1 of 3"));
  await press(page, page.getByRole("button", { name: /^Launch, / }));
  await page.clock.runFor(100_000);
  await press(page, page.getByRole("button", { name: /^Landed, / }));
  await page.clock.runFor(120_000); // past the 3:33 deadline of attempt 1
  await page.evaluate(() => document.dispatchEvent(new Event("visibilitychange")));
  const next = page.getByRole("button", { name: "Launch signal, attempt 2 of 3" });
  await settle(page, next);
  await press(page, next);
  await settle(page, page.getByText("Attempt 2 of 3"));
  await expect(page.getByRole("button", { name: /^Launch, / })).toBeVisible();
});
