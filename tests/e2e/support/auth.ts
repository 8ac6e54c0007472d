import { expect, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "windowcall-demo";

/** Signs in through the real form, as a pilot would. */
export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { name: /^Hello,/ })).toBeVisible();
}
