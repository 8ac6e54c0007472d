import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

/**
 * Contests (issue 15), with the seeded demo clubs: Ines is Heronmoor's officer, Ada a member,
 * Quinn a member of another club. The officer sets up 5 rounds (F3K.10), Ada enters, the officer
 * adds paper entries up to 10 pilots, makes the draw (2 groups of 5 each round, F3K.9.1) and locks it.
 */
test("an officer sets up a contest of 5 rounds, pilots enter, the draw is made, shown and locked; a non-member gets 404", async ({ page, browser }) => {
  const name = `Frost Cup ${Date.now()}`;
  await signInAs(page, "ines@example.com");
  await page.goto("/clubs/heronmoor");
  await page.getByRole("link", { name: "Set up a contest" }).click();
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Date").fill("2027-03-06");
  await page.getByLabel("Largest group (pilots)").fill("5");
  await page.getByRole("combobox", { name: "Round 5 task" }).selectOption("A");
  await expect(page.getByRole("list", { name: "Rule checks" })).toContainText("Round 5 repeats task A");
  await page.getByRole("combobox", { name: "Round 5 task" }).selectOption("H");
  await expect(page.getByRole("list", { name: "Rule checks" })).toHaveCount(0);
  await page.getByRole("button", { name: "Create the contest" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
  await expect(page.getByRole("list", { name: "Rounds" }).getByRole("listitem")).toHaveCount(5);
  const url = page.url();

  const ada = await (await browser.newContext()).newPage();
  await signInAs(ada, "ada@example.com");
  // Home lists the coming contests of Ada's club: the seeded one and this one
  await expect(ada.getByRole("list", { name: "Coming contests" })).toContainText("Heronmoor Winter Cup");
  await ada.getByRole("list", { name: "Coming contests" }).getByRole("link", { name }).click();
  await expect(ada.getByRole("heading", { name })).toBeVisible();
  await ada.getByRole("button", { name: "Enter this contest" }).click();
  await expect(ada.getByText("You are entered.")).toBeVisible();
  await expect(ada.getByRole("button", { name: "Add the paper entry" })).toHaveCount(0);

  await page.reload();
  for (let i = 1; i <= 9; i++) {
    await page.getByLabel("Pilot's name").fill(`Paper Pilot ${i}`);
    await page.getByRole("button", { name: "Add the paper entry" }).click();
    await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem")).toHaveCount(i + 1);
  }
  await page.getByRole("button", { name: "Withdraw Paper Pilot 9" }).click();
  await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem")).toHaveCount(9);
  await page.getByLabel("Pilot's name").fill("Paper Pilot 10");
  await page.getByRole("button", { name: "Add the paper entry" }).click();
  await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem")).toHaveCount(10);

  await page.getByRole("button", { name: "Make the draw" }).click();
  await expect(page.getByText(/^Seed \d+$/)).toBeVisible();
  for (let r = 1; r <= 5; r++) {
    const round = page.getByRole("region", { name: `Round ${r}` });
    await expect(round.getByText(/^Group 2:/)).toBeVisible();
    await expect(round).toContainText("Ada Fenwick");
    await expect(round).not.toContainText("Paper Pilot 9");
  }
  await page.getByRole("button", { name: "Lock the draw" }).click();
  await expect(page.getByText(/^Seed \d+ · locked$/)).toBeVisible();
  await expect(page.getByRole("button", { name: "Draw again" })).toHaveCount(0);

  const quinn = await (await browser.newContext()).newPage();
  await signInAs(quinn, "quinn@example.com");
  expect((await quinn.goto(url))?.status()).toBe(404);
  expect((await quinn.goto("/contests/new?club=heronmoor"))?.status()).toBe(404);
  const api = await quinn.request.post(`${url.replace("/contests/", "/api/contests/")}/draw`, { data: {}, headers: { origin: new URL(url).origin } });
  expect(api.status()).toBe(404);
  // a member who is not an officer: 404 on the set-up page and 403 on the officer routes
  expect((await ada.goto("/contests/new?club=heronmoor"))?.status()).toBe(404);
  expect((await ada.request.post(`${url.replace("/contests/", "/api/contests/")}/draw`, { data: {}, headers: { origin: new URL(url).origin } })).status()).toBe(403);
});
