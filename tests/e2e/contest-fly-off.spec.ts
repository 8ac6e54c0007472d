import { expect, test, type APIRequestContext } from "@playwright/test";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";

/**
 * The fly-off end to end (issue 15), as the demo club's officer (Ines) runs it: she plans a contest
 * with 5 rounds and a fly-off of 3 rounds (M, A, B; task M is for fly-offs only, F3K.10) for the best 3,
 * scores the preliminary rounds from paper cards, is refused the fly-off draw while round 5 is open,
 * draws it (two pilots tied for 3rd both fly: common practice, RULES.md is silent), enters fly-off
 * round 1 from paper cards and sees the fly-off table decide the top places once 3 rounds are
 * complete (F3K.10: preliminary points do not carry over).
 */

const PILOTS = ["Rhea Calloway", "Silas Penwright", "Tamsin Oakhurst", "Ulric Fenmore", "Vera Linwood", "Wynn Ashby"];
/** One flight per card in every preliminary round (tenths, under every task's cap): Tamsin and Ulric tie exactly. */
const PRELIM = [1100, 1000, 900, 900, 700, 600];

async function saveCards(request: APIRequestContext, headers: Record<string, string>, contestId: string, round: string, cards: [string, number[]][]) {
  const res = await request.put(`/api/contests/${contestId}/rounds/${round}/cards`, { headers, data: {
    groupNumber: 1, cards: cards.map(([entryId, flights]) => ({ entryId, flights, penaltyPoints: 0, signed: true })),
  } });
  expect(res.status(), await res.text()).toBe(200);
}

test("the officer plans a fly-off, scores the preliminary rounds, draws the fly-off and sees it decide the top places", async ({ page, baseURL }) => {
  test.setTimeout(120_000);
  await signInAs(page, "ines@example.com");
  const headers = sameOrigin(baseURL);
  const name = `Marsh Fly-off Cup ${Date.now()}`;

  // Set-up: 5 rounds (the form's A B D F G), a fly-off of 3 rounds for the best 3, groups of 6.
  await page.goto("/contests/new?club=heronmoor");
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Date").fill("2027-06-12");
  await page.getByLabel("Largest group (pilots)").fill("6");
  await page.getByRole("button", { name: "Plan a fly-off" }).click();
  await expect(page.getByRole("combobox", { name: "Fly-off round 1 task" })).toHaveValue("M");
  // task M is offered for fly-off rounds only (the server refuses it elsewhere too: contest-fly-off.test.ts)
  await expect(page.getByRole("combobox", { name: "Round 5 task" }).locator("option", { hasText: /^M$/ })).toHaveCount(0);
  await expect(page.getByRole("combobox", { name: "Fly-off round 2 task" }).locator("option", { hasText: /^M$/ })).toHaveCount(1);
  // the number of pilots is asked for
  await expect(page.getByRole("list", { name: "Rule checks" })).toContainText("Give how many pilots fly the fly-off: 2 to 30.");
  await page.getByLabel("Pilots in the fly-off").fill("3");
  await expect(page.getByRole("list", { name: "Rule checks" })).toHaveCount(0);
  await page.getByRole("button", { name: "Create the contest" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
  const contestId = new URL(page.url()).pathname.split("/").at(-1)!;
  await expect(page.getByRole("list", { name: "Fly-off rounds" }).getByRole("listitem")).toHaveText([/^Task M: Huge ladder/, /^Task A:/, /^Task B:/]);

  // Entries on paper and the draw (one group of 6), through the API as the other specs do.
  const ids: string[] = [];
  for (const pilotName of PILOTS) {
    const res = await page.request.post(`/api/contests/${contestId}/paper-entries`, { headers, data: { pilotName } });
    ids.push(((await res.json()) as { entry: { id: string } }).entry.id);
  }
  expect((await page.request.post(`/api/contests/${contestId}/draw`, { headers, data: {} })).status()).toBe(201);

  // Rounds 1–4 from paper cards; the fly-off cannot be drawn while round 5 is open.
  for (const round of ["1", "2", "3", "4"]) await saveCards(page.request, headers, contestId, round, ids.map((id, i) => [id, [PRELIM[i]!]]));
  await page.reload();
  const section = page.getByRole("region", { name: "Fly-off", exact: true });
  await section.getByRole("button", { name: "Draw the fly-off" }).click();
  await expect(section.getByRole("alert")).toHaveText("Score every preliminary round before the fly-off is drawn: round 5 has 6 pilots without a result.");

  // Round 5 typed in on its paper-cards page, as the officer would.
  await page.getByRole("link", { name: "Paper cards for round 5" }).click();
  const form = page.getByRole("form", { name: "Group 1" });
  for (const [i, pilot] of PILOTS.entries()) {
    await form.getByLabel(`Flight times of ${pilot}`).fill((PRELIM[i]! / 10).toFixed(1));
    await form.getByLabel(`Signed (${pilot})`).check();
  }
  await form.getByRole("button", { name: "Save group 1" }).click();
  await expect(form.getByText("Group 1 saved.")).toBeVisible();

  // The draw: the best 3, and Ulric tied with Tamsin for 3rd flies too.
  await page.goto(`/contests/${contestId}`);
  await section.getByRole("button", { name: "Draw the fly-off" }).click();
  await expect(section.getByRole("status")).toHaveText("Tied at the cut-off, all of them fly: Tamsin Oakhurst, Ulric Fenmore.");
  await expect(section.locator("p", { hasText: /^Fly-off pilots \(4\):/ })).toHaveText("Fly-off pilots (4): Rhea Calloway, Silas Penwright, Tamsin Oakhurst, Ulric Fenmore");

  // Fly-off round 1 (task M, flights against 180, 300, 420 s): its timekeepers' page and its paper cards.
  await page.getByRole("link", { name: "Timekeepers for fly-off round 1" }).click();
  await expect(page.getByRole("heading", { name: "Fly-off round 1: timekeepers" })).toBeVisible();
  await page.getByRole("link", { name: "Paper cards", exact: true }).click();
  await expect(page.getByRole("heading", { name: "Fly-off round 1: paper cards" })).toBeVisible();
  const ladder: Record<string, string> = { "Rhea Calloway": "180 300 400", "Silas Penwright": "170 290 400", "Tamsin Oakhurst": "100 100 100", "Ulric Fenmore": "60 60 60" };
  const flyForm = page.getByRole("form", { name: "Group 1" });
  for (const [pilot, flights] of Object.entries(ladder)) {
    await flyForm.getByLabel(`Flight times of ${pilot}`).fill(flights);
    await flyForm.getByLabel(`Signed (${pilot})`).check();
  }
  await flyForm.getByRole("button", { name: "Save group 1" }).click();
  await expect(flyForm.getByText("Group 1 saved.")).toBeVisible();

  // Two of three rounds complete: the preliminary order stands.
  await saveCards(page.request, headers, contestId, "fly-off-2", [[ids[0]!, [2000]], [ids[1]!, [3000]], [ids[2]!, [1000]], [ids[3]!, [900]]]);
  await page.goto(`/contests/${contestId}/results`);
  await expect(page.getByText("Fewer than 3 complete fly-off rounds: the preliminary order stands for now.")).toBeVisible();

  // Round 3 (task B, last two flights): Silas best again. The fly-off now decides: Silas first.
  await saveCards(page.request, headers, contestId, "fly-off-3", [[ids[0]!, [1500, 1500]], [ids[1]!, [2400, 2400]], [ids[2]!, [1000, 1000]], [ids[3]!, [800, 800]]]);
  await page.reload();
  await expect(page.getByText("The fly-off decides the top places.")).toBeVisible();
  const flyOff = page.getByRole("table", { name: "Fly-off" });
  await expect(flyOff.getByRole("rowheader")).toHaveText([/Silas Penwright/, /Rhea Calloway/, /Tamsin Oakhurst/, /Ulric Fenmore/]);

  // Drawing again now would delete fly-off results: refused, with a confirmed way through offered.
  await page.goto(`/contests/${contestId}`);
  await section.getByRole("button", { name: "Draw the fly-off again" }).click();
  await expect(section.getByRole("alert")).toHaveText("Fly-off results are already entered: drawing again deletes them. Confirm to draw again.");
  await expect(section.getByRole("button", { name: "Draw again and delete the fly-off results" })).toBeVisible();
});

test("the demo contest shows its planned fly-off, not drawn while rounds are still open", async ({ page }) => {
  await signInAs(page, "ines@example.com");
  await page.getByRole("list", { name: "Coming contests" }).getByRole("link", { name: "Heronmoor Winter Cup" }).click();
  const section = page.getByRole("region", { name: "Fly-off", exact: true });
  await expect(section.getByRole("list", { name: "Fly-off rounds" }).getByRole("listitem")).toHaveCount(3);
  await expect(section.getByText("Not drawn yet: the officer draws the fly-off once every preliminary round is scored.")).toBeVisible();
  await section.getByRole("button", { name: "Draw the fly-off" }).click();
  await expect(section.getByRole("alert")).toContainText("Score every preliminary round before the fly-off is drawn: round 4 has");
});
