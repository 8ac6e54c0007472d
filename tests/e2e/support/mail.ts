import { expect, type Page } from "@playwright/test";

/** Opens the local mailbox (/dev/mailbox) until a message with this subject to `email` is there; returns it. */
export async function openMail(page: Page, subject: RegExp, email: string) {
  const message = page.getByRole("article", { name: subject }).filter({ hasText: email }).first();
  await expect(async () => {
    await page.goto("/dev/mailbox");
    await expect(message).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 20_000 });
  return message;
}
