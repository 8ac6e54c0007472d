import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";

/**
 * Entry fees (issue 15) through the local payments fake (scripts/payments-server.ts, started beside the
 * app by the test scripts): Ines (Heronmoor's officer) sets up a contest with a fee; Ada enters, her
 * card is declined on the payments page, she comes back and pays on the retry; the webhook marks the
 * entry paid and Ines sees it; Tobi pays and withdraws himself (refunded); Ines marks a paper entry's cash and withdraws Ada before entries close
 * (refunded). On a 360 px phone; axe finds nothing serious on the contest page or the payments parts.
 */
test.use({ viewport: { width: 360, height: 800 } });

async function noSeriousViolations(page: Page, what: string) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${what}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

test("a pilot enters a paid contest: the first payment fails, the retry succeeds, the officer sees it paid, marks cash and refunds a withdrawal", async ({ page, browser }) => {
  test.setTimeout(120_000);
  const name = `Thaw Cup ${Date.now()}`;
  await signInAs(page, "ines@example.com");
  await page.goto("/contests/new?club=heronmoor");
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Date", { exact: true }).fill("2027-03-06");
  await page.getByLabel("Entry fee (empty: free)").fill("12.50");
  await page.getByLabel("Currency").selectOption("eur");
  await page.getByRole("button", { name: "Create the contest" }).click();
  // a fee without a closing time is refused, with the reason
  await expect(page.getByRole("alert").filter({ hasText: "A contest with an entry fee needs the time entries close" })).toBeVisible();
  await page.getByLabel("Entries close (withdrawals before then are refunded)").fill("2027-03-04T18:00");
  await noSeriousViolations(page, "set-up");
  await page.getByRole("button", { name: "Create the contest" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
  await expect(page.getByText(/^Entry fee 12\.50 EUR · entries close .* 2027/)).toBeVisible();
  const contestUrl = page.url();

  const ada = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(ada, "ada@example.com");
  await ada.goto(contestUrl);
  await expect(ada.getByText("The entry fee is 12.50 EUR")).toBeVisible();
  await ada.getByRole("button", { name: "Enter and pay" }).click();
  // the payments fake's own page, on loopback
  await expect(ada.getByRole("heading", { name: "Test payment" })).toBeVisible();
  expect(new URL(ada.url()).pathname).toMatch(/^\/pay\/cs_test_/);
  await expect(ada.getByText("Entry fee: Thaw Cup")).toContainText("12.50 EUR");
  await ada.getByRole("button", { name: "Decline the card" }).click();
  await expect(ada.getByRole("alert")).toContainText("Your card was declined");
  await ada.getByRole("link", { name: "Back to Windowcall without paying" }).click();
  // back on the contest: the signed webhook has marked the entry failed
  const fee = ada.getByRole("group", { name: "Your entry fee" });
  await expect(fee).toContainText("Entry fee 12.50 EUR: payment failed.");
  await expect(fee.getByRole("status")).toContainText("No money was taken");
  await noSeriousViolations(ada, "contest page, payment failed");
  await fee.getByRole("button", { name: "Try the payment again" }).click();
  await expect(ada.getByRole("heading", { name: "Test payment" })).toBeVisible();
  await ada.getByRole("button", { name: "Pay 12.50 EUR" }).click();
  await expect(fee).toContainText("Entry fee 12.50 EUR: paid by card.");
  await expect(fee.getByRole("button")).toHaveCount(0);
  expect(new URL(ada.url()).searchParams.get("payment")).toBe("done");

  // another pilot pays at once, then withdraws before entries close: the card payment comes back
  const tobi = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(tobi, "tobi@example.com");
  await tobi.goto(contestUrl);
  await tobi.getByRole("button", { name: "Enter and pay" }).click();
  await tobi.getByRole("button", { name: "Pay 12.50 EUR" }).click();
  await expect(tobi.getByRole("group", { name: "Your entry fee" })).toContainText("paid by card");
  await tobi.getByRole("button", { name: "Withdraw my entry (the card payment is refunded)" }).click();
  await expect(tobi.getByRole("button", { name: "Enter and pay" })).toBeVisible();

  // the officer sees the entry paid
  await page.reload();
  await expect(page.getByRole("list", { name: "Withdrawn entries" })).toContainText("Tobi Okafor · refunded");
  await expect(page.getByRole("list", { name: "Entries", exact: true })).toContainText("Ada Fenwick · paid by card");
  const fees = page.getByRole("region", { name: "Entry fees" });
  await expect(fees).toContainText("1 of 1 entries paid · 12.50 EUR taken");
  await expect(fees).toContainText("Every entry is paid.");
  // a paper entry is unpaid until the officer takes the cash
  await page.getByLabel("Pilot's name").fill("Wren Oakhollow");
  await page.getByRole("button", { name: "Add the paper entry" }).click();
  await expect(page.getByRole("list", { name: "Unpaid entries" })).toContainText("Wren Oakhollow · unpaid");
  await noSeriousViolations(page, "contest page, officer");
  await page.getByRole("button", { name: "Mark Wren Oakhollow paid in cash" }).click();
  await expect(fees).toContainText("2 of 2 entries paid · 25.00 EUR taken");
  await expect(page.getByRole("list", { name: "Entries", exact: true })).toContainText("Wren Oakhollow (paper) · paid in cash");
  // withdrawn before entries close: Ada's card payment is refunded through the payments service
  await page.getByRole("button", { name: "Withdraw Ada Fenwick" }).click();
  await expect(page.getByRole("list", { name: "Withdrawn entries" })).toContainText("Ada Fenwick · refunded");
  await expect(fees).toContainText("1 of 1 entries paid");
});

test("the officer sees the demo contest's unpaid entries, and a member sees only their own fee", async ({ page, browser }) => {
  await signInAs(page, "ines@example.com");
  await page.goto("/");
  await page.getByRole("list", { name: "Coming contests" }).getByRole("link", { name: "Heronmoor Winter Cup" }).click();
  await expect(page.getByText(/^Entry fee 15\.00 EUR/)).toBeVisible();
  const unpaid = page.getByRole("list", { name: "Unpaid entries" });
  await expect(unpaid).toContainText("Ada Fenwick · unpaid");
  await expect(unpaid).toContainText("Lena Strand · payment failed");
  await expect(unpaid).not.toContainText("Tobi Okafor");
  await expect(page.getByRole("list", { name: "Entries", exact: true })).toContainText("Tobi Okafor · paid by card");
  await expect(page.getByRole("list", { name: "Withdrawn entries" })).toContainText("Rafe Dunmore · unpaid");

  const lena = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(lena, "lena@example.com");
  await lena.goto(page.url());
  await expect(lena.getByRole("group", { name: "Your entry fee" })).toContainText("payment failed");
  await expect(lena.getByRole("region", { name: "Entry fees" })).toHaveCount(0);
  await expect(lena.getByRole("list", { name: "Entries", exact: true })).not.toContainText("paid");
});
