import AxeBuilder from "@axe-core/playwright";
import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

/**
 * Contests (issue 15), with the seeded demo clubs: Ines is Heronmoor's officer, Ada a member,
 * Quinn a member of another club. The officer sets up 5 rounds (F3K.10), Ada enters, the officer
 * adds paper entries up to 10 pilots, makes the draw (2 groups of 5 each round, F3K.9.1) and locks it.
 */
test("an officer sets up a contest of 5 rounds, pilots enter, the draw is made, shown and locked; a non-member gets 404", async ({ page, browser }) => {
  test.setTimeout(120_000);
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
  await page.getByLabel("Points rounding").selectOption({ label: "Cut off (always down)" });
  await page.getByRole("button", { name: "Create the contest" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
  await expect(page.getByText(/points cut off at 0\.1 · rules F3K 2025/)).toBeVisible();
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
  await page.getByLabel(/^A junior/).check();
  await page.getByRole("button", { name: "Add the paper entry" }).click();
  await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem")).toHaveCount(10);
  await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem").filter({ hasText: "Paper Pilot 10" })).toContainText("junior");
  // the officer puts two entries in a team, one of them a junior
  for (const pilot of ["Paper Pilot 1", "Paper Pilot 2"]) {
    const details = page.getByRole("form", { name: `Team and class of ${pilot}`, exact: true });
    await details.getByLabel(`Team of ${pilot}`, { exact: true }).fill("Updraft");
    if (pilot === "Paper Pilot 2") await details.getByLabel(`Class of ${pilot}`, { exact: true }).selectOption("junior");
    await details.getByRole("button", { name: "Save" }).click();
    await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem").filter({ hasText: new RegExp(`^${pilot} \\(paper\\)`) })).toContainText("team Updraft");
  }
  await expect(page.getByRole("list", { name: "Entries" }).getByRole("listitem").filter({ hasText: /^Paper Pilot 2 \(paper\)/ })).toContainText("junior · team Updraft");

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

  // on the day, after the lock: two pilots of round 2 trade groups, a swap within one group is
  // refused with the reason, and rounds 4–5 are drawn again while rounds 1–3 stay as they were
  const groupOf = async (round: number, group: number) =>
    ((await page.getByRole("region", { name: `Round ${round}` }).locator("p", { hasText: new RegExp(`^Group ${group}:`) }).textContent()) ?? "")
      .replace(/^Group \d+:\s*/, "").split(", ");
  const [one, two] = [await groupOf(2, 1), await groupOf(2, 2)];
  const swap = page.getByRole("form", { name: "Swap two pilots" });
  await swap.getByLabel("Round").selectOption("2");
  await swap.getByLabel("First pilot").selectOption({ label: `${one[0]} (group 1)` });
  await swap.getByLabel("Second pilot").selectOption({ label: `${two[0]} (group 2)` });
  await swap.getByRole("button", { name: "Swap their groups" }).click();
  await expect(swap.getByRole("status")).toHaveText(`Round 2: ${one[0]} (to group 2) and ${two[0]} (to group 1) traded groups.`);
  await expect.poll(() => groupOf(2, 1)).toContain(two[0]);
  expect(await groupOf(2, 2)).toContain(one[0]);
  await swap.getByLabel("First pilot").selectOption({ label: `${one[1]} (group 1)` });
  await swap.getByLabel("Second pilot").selectOption({ label: `${one[2]} (group 1)` });
  await swap.getByRole("button", { name: "Swap their groups" }).click();
  await expect(swap.getByRole("alert")).toHaveText(`${one[1]} and ${one[2]} already fly in group 1.`);

  const early = [];
  for (let r = 1; r <= 3; r++) early.push(await page.getByRole("region", { name: `Round ${r}` }).textContent());
  const redraw = page.getByRole("form", { name: "Draw the remaining rounds again" });
  await redraw.getByLabel("From round").selectOption("4");
  await redraw.getByRole("button", { name: "Draw them again" }).click();
  await expect(redraw.getByRole("status")).toHaveText(/^Rounds 4–5 drawn again for 10 pilots \(seed \d+\)\.$/);
  for (let r = 1; r <= 3; r++) await expect(page.getByRole("region", { name: `Round ${r}` })).toHaveText(early[r - 1]!);
  const changes = page.getByRole("region", { name: "Changes to the draw" }).getByRole("listitem");
  await expect(changes).toHaveCount(2);
  await expect(changes.first()).toContainText("Rounds 4–5 drawn again");
  await expect(changes.first()).toContainText("Ines");
  const { violations } = await new AxeBuilder({ page }).analyze();
  expect(violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => v.id)).toEqual([]);

  const quinn = await (await browser.newContext()).newPage();
  await signInAs(quinn, "quinn@example.com");
  expect((await quinn.goto(url))?.status()).toBe(404);
  expect((await quinn.goto("/contests/new?club=heronmoor"))?.status()).toBe(404);
  const api = await quinn.request.post(`${url.replace("/contests/", "/api/contests/")}/draw`, { data: {}, headers: { origin: new URL(url).origin } });
  expect(api.status()).toBe(404);
  // a member who is not an officer: 404 on the set-up page and 403 on the officer routes
  expect((await ada.goto("/contests/new?club=heronmoor"))?.status()).toBe(404);
  expect((await ada.request.post(`${url.replace("/contests/", "/api/contests/")}/draw`, { data: {}, headers: { origin: new URL(url).origin } })).status()).toBe(403);
  expect((await ada.request.post(`${url.replace("/contests/", "/api/contests/")}/draw/redraw`, { data: { fromRound: 4 }, headers: { origin: new URL(url).origin } })).status()).toBe(403);
  // a member sees the changes to the draw but not the officer's forms
  await ada.goto(url);
  await expect(ada.getByRole("region", { name: "Changes to the draw" }).getByRole("listitem")).toHaveCount(2);
  await expect(ada.getByRole("form", { name: "Swap two pilots" })).toHaveCount(0);
});
