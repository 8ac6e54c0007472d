import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";
import { openMail } from "./support/mail";

/**
 * Clubs (issue #14), with the seeded demo clubs: Ines is Heronmoor's officer, Quinn a member of
 * Kestrel Downs, Ada a Heronmoor member. The invitation goes through the local SMTP fake and is read
 * on /dev/mailbox, as a developer would.
 */

test("an officer invites by e-mail; the invitee follows the link, creates an account and joins as coach; the link then fails", async ({ page, browser }) => {
  const invitee = `invitee-${Date.now()}@example.com`;
  await signInAs(page, "ines@example.com");
  await page.getByRole("link", { name: "Clubs" }).click();
  await page.getByRole("link", { name: /Heronmoor Hand-Launch Club/ }).click();
  await expect(page.getByRole("heading", { name: "Heronmoor Hand-Launch Club" })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail to invite").fill(invitee);
  await page.getByLabel("Role", { exact: true }).selectOption("coach");
  await page.getByRole("button", { name: "Send the invitation" }).click();
  await expect(page.getByRole("status")).toHaveText(`Invitation sent to ${invitee}.`);

  // the invitee, on another browser with nobody signed in
  const context = await browser.newContext();
  const other = await context.newPage();
  const mail = await openMail(other, /Join Heronmoor Hand-Launch Club/, invitee);
  const link = mail.getByRole("link", { name: /\/join-club\?token=/ });
  const href = await link.getAttribute("href");
  await link.click();
  await expect(other.getByRole("heading", { name: "Join Heronmoor Hand-Launch Club" })).toBeVisible();
  await expect(other.getByText("You are invited as coach")).toBeVisible();
  await other.getByRole("link", { name: "Create an account" }).click();
  await other.waitForLoadState("networkidle");
  await other.getByLabel("Name").fill("Invited Coach");
  await other.getByLabel("E-mail").fill(invitee);
  await other.getByLabel(/^Password/).fill("invited-thermal-26");
  await other.getByRole("button", { name: "Create account" }).click();
  await expect(other.getByRole("status")).toContainText("Check your e-mail");
  await other.getByLabel("Password").fill("invited-thermal-26");
  await other.getByRole("button", { name: "Sign in" }).click();
  await expect(other.getByRole("heading", { name: "Join Heronmoor Hand-Launch Club" })).toBeVisible();
  await other.waitForLoadState("networkidle");
  await other.getByRole("button", { name: "Join Heronmoor Hand-Launch Club" }).click();
  await expect(other.getByRole("status")).toHaveText("Welcome to Heronmoor Hand-Launch Club.");
  await other.getByRole("link", { name: "Open the club" }).click();
  await expect(other.getByText("You are coach here.")).toBeVisible();
  await expect(other.getByRole("list", { name: "Members" }).getByText("Invited Coach (you)")).toBeVisible();

  await other.goto(href!); // a second use fails with a message
  await expect(other.getByRole("main").getByRole("alert")).toContainText("already used");
  await context.close();

  await page.reload(); // the officer sees the new coach
  await expect(page.getByRole("list", { name: "Members" }).getByText("Invited Coach", { exact: true })).toBeVisible();
});

test("a member of another club gets 404 on the club's page; their own club's page shows its fields", async ({ page }) => {
  await signInAs(page, "quinn@example.com");
  const res = await page.goto("/clubs/heronmoor");
  expect(res?.status()).toBe(404);
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
  await expect(page.getByText("Heronmoor")).toHaveCount(0);
  const missing = await page.goto("/clubs/no-such-club");
  expect(missing?.status()).toBe(404);

  await page.goto("/clubs/kestrel-downs");
  await expect(page.getByRole("heading", { name: "Kestrel Downs Soaring Club" })).toBeVisible();
  await expect(page.getByRole("listitem", { name: "Long Barrow Field" })).toContainText("The mound itself is protected");
  await expect(page.getByRole("button", { name: /^Remove/ })).toHaveCount(0); // a member removes nobody
});

test("naming a club field on the new-window form shows its cautions beside the usual ones", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/field/new");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Field", { exact: true }).fill("five acre meadow");
  const cautions = page.getByRole("region", { name: "Flying at Five Acre Meadow" });
  await expect(cautions).toContainText("Launch towards the north-west hedge");
  await expect(cautions).toContainText("The car park and the footpath are safety areas");
  await cautions.getByText("The usual safety cautions").click();
  await expect(cautions).toContainText("do not replace the rules of your field");
  await page.getByLabel("Field", { exact: true }).fill("Somewhere else");
  await expect(cautions).toHaveCount(0);
});
