import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";

/**
 * Pilot-owned practice plans: made on /field, kept on the phone, and walked task by task
 * when a window is set up at /field/new.
 */
test.use({ viewport: { width: 390, height: 844 } });

async function openField(page: Page) {
  await page.goto("/field");
  await expect(page.getByRole("heading", { name: "Practice plans" })).toBeVisible();
}

async function choosePlan(page: Page, title: string) {
  await page.goto("/field/new");
  await expect(page.getByRole("heading", { name: "New task window" })).toBeVisible();
  await page.getByRole("radio", { name: /^From a practice plan/ }).check();
  await page.getByLabel("Practice plan", { exact: true }).selectOption({ label: title });
}

test("a plan walks its tasks in order, one window after another", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await openField(page);
  await page.getByRole("button", { name: "New plan" }).click();
  await page.getByLabel("Plan title").fill("Ladder week");
  await page.getByLabel("Task to add").selectOption("K:600");
  await page.getByRole("button", { name: "Add", exact: true }).click();
  await page.getByLabel("Task to add").selectOption("H:600");
  await page.getByRole("button", { name: "Add", exact: true }).click();
  const added = page.getByRole("list", { name: "Tasks in this plan" }).getByRole("listitem");
  await expect(added).toHaveCount(2);
  await expect(added.nth(0)).toContainText("K · Big ladder");
  await expect(added.nth(1)).toContainText("H · 1, 2, 3 and 4 minute");
  await page.screenshot({ path: "/tmp/plans-editor.png", fullPage: true });
  await page.getByRole("button", { name: "Save plan" }).click();
  const saved = page.getByRole("list", { name: "Your practice plans" }).getByRole("listitem").filter({ hasText: "Ladder week" });
  await expect(saved).toContainText("K → H");
  await page.screenshot({ path: "/tmp/plans-field.png", fullPage: true });

  await choosePlan(page, "Ladder week");
  await expect(page.getByRole("radio", { name: /^1\. K · Big ladder \(next\)/ })).toBeChecked();
  await expect(page.getByRole("radio", { name: /^2\. H · / })).not.toBeChecked();
  await page.screenshot({ path: "/tmp/plans-new.png", fullPage: true });
  await page.getByLabel("Field").fill("North Meadow");
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  await expect(page.getByRole("heading", { name: "Task K · Big ladder" })).toBeVisible();

  await choosePlan(page, "Ladder week");
  await expect(page.getByRole("radio", { name: /^2\. H · .* \(next\)/ })).toBeChecked();
  await expect(page.getByRole("radio", { name: /^1\. K · / })).not.toBeChecked();
});

test("a plan without a title is refused and nothing is saved", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await openField(page);
  // Each test has its own browser context, so this phone starts with no plans.
  await expect(page.getByText(/^No plans yet/)).toBeVisible();
  await page.getByRole("button", { name: "New plan" }).click();
  await page.getByLabel("Task to add").selectOption("K:600");
  await page.getByRole("button", { name: "Add", exact: true }).click();
  await page.getByRole("button", { name: "Save plan" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "The plan was not saved" })).toBeVisible();
  await expect(page.getByLabel("Plan title")).toHaveAttribute("aria-invalid", "true");
  await expect(page.getByText("Give the plan a title.")).toBeVisible();
  await page.reload();
  await expect(page.getByRole("heading", { name: "Practice plans" })).toBeVisible();
  await expect(page.getByText(/^No plans yet/)).toBeVisible();
  await expect(page.getByRole("list", { name: "Your practice plans" })).toHaveCount(0);
});
