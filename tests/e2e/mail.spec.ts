import { expect, test } from "@playwright/test";
import { signUpByApi } from "./support/api";
import { signInAs } from "./support/auth";
import { openMail } from "./support/mail";

/**
 * E-mail through the local SMTP fake, read on /dev/mailbox as a developer would: a forgotten
 * password, a sign-up with a taken address, verifying an address.
 */

test("forgot password: the mailed link sets a new password once, and it signs in", async ({ page, baseURL }) => {
  const email = await signUpByApi(page.request, baseURL, "Reset Pilot", "reset", "old-thermal-2026");
  await page.goto("/sign-in");
  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(page.getByRole("heading", { name: "Forgot your password" })).toBeVisible();
  await page.waitForLoadState("networkidle"); // the form is interactive (a fill before hydration is lost)
  await page.getByLabel("E-mail").fill(email);
  await expect(page.getByLabel("E-mail")).toHaveValue(email);
  await page.getByRole("button", { name: "Send me a link" }).click();
  await expect(page.getByRole("status")).toContainText("Check your e-mail");

  const mail = await openMail(page, /Reset your password/, email);
  const link = mail.getByRole("link", { name: /\/reset-password\?token=/ });
  const href = await link.getAttribute("href");
  await link.click();
  await expect(page.getByRole("heading", { name: "Choose a new password" })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.getByLabel(/^New password/).fill("new-thermal-2027");
  await page.getByRole("button", { name: "Set new password" }).click();
  await expect(page.getByRole("status")).toContainText("Your password is changed");

  await page.goto(href!, { waitUntil: "networkidle" }); // the second use fails with a message
  await page.getByLabel(/^New password/).fill("third-thermal-2028");
  await page.getByRole("button", { name: "Set new password" }).click();
  await expect(page.getByRole("main").getByRole("alert")).toContainText("already used");

  await signInAs(page, email, "new-thermal-2027");
});

test("a sign-up with a taken address looks like a new one; the owner is told by e-mail", async ({ page, baseURL }) => {
  const taken = await signUpByApi(page.request, baseURL, "Owner Pilot", "owner", "owners-thermal-26");
  const fresh = `fresh-${Date.now()}@example.com`;
  const shown: string[] = [];
  for (const email of [taken, fresh]) {
    await page.goto("/sign-up");
    await page.getByLabel("Name").fill("Someone Else");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel(/^Password/).fill("someone-elses-26");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page.getByRole("status")).toContainText("Check your e-mail");
    shown.push((await page.getByRole("main").innerText()).replace(email, "<e-mail>"));
  }
  expect(shown[0]).toBe(shown[1]);

  const notice = await openMail(page, /Someone tried to create an account/, taken);
  await expect(notice.getByRole("link", { name: /\/forgot-password/ })).toBeVisible();
  await openMail(page, /Confirm your e-mail address/, fresh);
});

test("a new account works before its address is verified; Settings says so until the link is followed", async ({ page, baseURL }) => {
  const email = await signUpByApi(page.request, baseURL, "Verify Pilot", "verify", "verify-thermal-26");
  await signInAs(page, email, "verify-thermal-26");
  await page.goto("/settings");
  await expect(page.getByText("not verified")).toBeVisible();
  await page.getByRole("button", { name: "Resend the link" }).click();
  await expect(page.getByText("Sent. Check your e-mail for the link.")).toBeVisible();

  const mail = await openMail(page, /Confirm your e-mail address/, email);
  await mail.getByRole("link", { name: /\/verify-email\?token=/ }).first().click();
  await page.waitForLoadState("networkidle");
  await page.getByRole("button", { name: "Confirm my e-mail address" }).click();
  await expect(page.getByRole("status")).toHaveText("Thank you: your e-mail address is confirmed.");
  await page.goto("/settings");
  await expect(page.getByText(`${email} — verified`)).toBeVisible();
});
