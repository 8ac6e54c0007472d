import { randomBytes } from "node:crypto";
import { expect, test } from "@playwright/test";
import pg from "pg";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";
import { insertTrialContest } from "./support/contest-db";
import { insertPenaltyTrial, phonePenaltyRun } from "./support/phone-penalty";

/**
 * Issue #15, disputes recorded by officers: Ines (the demo club's officer) sees the demo contest's
 * disputes on its page (one upheld by a re-flight, one open) and the open one marked on the results; in
 * a contest of her own she records a team manager's protest on the round's page, the results and the
 * public link (signed out, no names) show the result under dispute, she rejects it with an outcome and
 * the mark goes. Penalties one by one: a timekeeper's phone run with a penalty, pushed, shows on the results
 * with its cause and who gave it; on the round's page she gives a pilot a penalty (the total drops), is
 * stopped from typing the phone's penalty again, and removes hers (struck through, the total returns).
 */
test.describe.configure({ timeout: 180_000 });

async function makeContest(db: pg.Client, token: string): Promise<string> {
  const { contestId, round1 } = await insertTrialContest(db, { name: "Protest Trial", startsOn: "2027-02-27", drawSeed: 5, publicToken: token });
  // invented pilots; signed paper cards of task A, tenths
  for (const [name, tenths] of [["Rue Castell", 1800], ["Sol Penhallow", 2000]] as const) {
    const { rows: [e] } = await db.query<{ id: string }>("insert into contest_entries (contest_id, pilot_name, paper) values ($1, $2, true) returning id", [contestId, name]);
    await db.query(
      "insert into group_slots (round_id, group_number, entry_id, paper_flights, signed_at, signed_from, recorded_at) values ($1, 1, $2, $3, now(), 'paper card', now())",
      [round1, e!.id, JSON.stringify([tenths])],
    );
  }
  return contestId;
}

test("an officer records a dispute, the results mark it (public link too, no names), and she resolves it", async ({ page, browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const token = randomBytes(32).toString("base64url");
    const contestId = await makeContest(db, token);
    const { rows: [demo] } = await db.query<{ id: string }>("select id from contests where name = 'Heronmoor Winter Cup'");
    await signInAs(page, "ines@example.com");

    // The demo contest: its page lists both disputes, the open one first; the upheld one links to the re-flight.
    await page.goto(`/contests/${demo!.id}`);
    await expect(page.getByRole("heading", { name: "Disputes (1 open, 1 resolved)" })).toBeVisible();
    const list = page.getByRole("list", { name: "Disputes" });
    await expect(list.getByRole("listitem").first()).toContainText("Round 3, Cass Merriden: The second flight landed inside the working time but was not counted (open)");
    await expect(list).toContainText("Lodged by Team manager of Cass Merriden");
    // when it was lodged and, apart, when an officer recorded it (club clock)
    await expect(list.getByRole("listitem").first()).toContainText(/recorded by [^,]+ \d{1,2} \w{3}, \d{2}:\d{2}/);
    await expect(list.getByRole("listitem").nth(1)).toContainText("upheld by Ines Varga");
    await expect(list.getByRole("link", { name: "a re-flight granted" })).toHaveAttribute("href", `/contests/${demo!.id}/rounds/2#reflights-title`);
    // and the results mark Cass's round 3 (the third round column)
    await page.goto(`/contests/${demo!.id}/results`);
    const cass = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Cass Merriden" }) }).first();
    await expect(cass.getByRole("cell").nth(3)).toContainText("result under dispute");

    // Her own contest: Rue's team manager protests round 1.
    await page.goto(`/contests/${contestId}/rounds/1`);
    const form = page.getByRole("form", { name: "Record a dispute" });
    await form.getByLabel("Pilot whose result is disputed").selectOption({ label: "Rue Castell (group 1)" });
    await form.getByLabel("What is disputed").fill("The landing was inside the working time");
    await form.getByLabel("Lodged by (name; pilot or team manager)").fill("Team manager of Rue Castell");
    await form.getByRole("button", { name: "Record the dispute" }).click();
    const item = page.getByRole("listitem", { name: "Dispute, Rue Castell" });
    await expect(item).toContainText("Rue Castell: The landing was inside the working time (open)");
    await expect(item).toContainText("Lodged by Team manager of Rue Castell");
    await expect(item).toContainText("recorded by Ines Varga");

    // Results while open: 180/200 × 1000 = 900.0 (F3K.9.1, by hand), marked; the dispute changes no points.
    await page.goto(`/contests/${contestId}/results`);
    const rue = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Rue Castell" }) }).first();
    await expect(rue.getByRole("cell").nth(1)).toContainText("900.0");
    await expect(rue.getByRole("cell").nth(1)).toContainText("result under dispute");
    // The public link, signed out: the mark, but not who lodged it or what it is about.
    const outsider = await browser.newContext();
    const pub = await outsider.newPage();
    await pub.goto(`/results/${token}`);
    const rueOut = pub.getByRole("row").filter({ has: pub.getByRole("rowheader", { name: "Rue Castell" }) }).first();
    await expect(rueOut.getByRole("cell").nth(1)).toContainText("result under dispute");
    await expect(pub.getByText("Team manager")).toHaveCount(0);
    await expect(pub.getByText("inside the working time")).toHaveCount(0);
    await outsider.close();

    // Rejected with an outcome: who and when kept, the mark gone.
    await page.goto(`/contests/${contestId}/rounds/1`);
    const resolve = page.getByRole("form", { name: "Resolve the dispute, Rue Castell" });
    await resolve.getByLabel("Rejected").check();
    await resolve.getByLabel("Outcome").fill("The timekeeper's card shows the landing after the horn");
    await resolve.getByRole("button", { name: "Resolve Rue Castell's dispute" }).click();
    await expect(item).toContainText("Rejected by Ines Varga");
    await expect(item).toContainText("The timekeeper's card shows the landing after the horn");
    await page.goto(`/contests/${contestId}/results`);
    await expect(rue.getByRole("cell").nth(1)).toContainText("900.0");
    await expect(rue.getByRole("cell").nth(1)).not.toContainText("result under dispute");
  } finally {
    await db.end();
  }
});

test("penalties one by one: the phone's on the results with its cause; an officer gives one on the round page, cannot type the phone's again, removes hers", async ({ page, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    // invented pilots: two signed paper cards of task A (tenths); Tam is timed on Ines's phone (she keeps his time)
    const { contestId, round1, inesId, ids, task } = await insertPenaltyTrial(db, { name: "Penalty Trial", startsOn: "2027-03-06", drawSeed: 6 });
    await signInAs(page, "ines@example.com");
    const pushed = await page.request.post("/api/sync/push", {
      headers: sameOrigin(baseURL),
      data: phonePenaltyRun({
        userId: inesId, roundId: round1, entryId: ids["Tam Ossory"]!, pilotName: "Tam Ossory", task, secs: 150, penalty: { reason: "Launched during the no-fly time", cause: "outside-time" },
      }).body,
    });
    expect(pushed.status()).toBe(200);
    expect(((await pushed.json()) as { acks: { status: string }[] }).acks.every((a) => a.status === "applied")).toBe(true);

    // By hand (F3K.9.1, F3K.10): Sol 200.0 s = 1000.0; Wren 180.0/200.0 = 900.0; Tam 150.0/200.0 = 750.0 less the phone's 100 (F3K.9.5) = 650.0.
    const total = (name: string) => page.getByRole("row").filter({ has: page.getByRole("rowheader", { name }) }).first().getByRole("cell").last();
    await page.goto(`/contests/${contestId}/results`);
    await expect(total("Tam Ossory")).toHaveText("650.0");
    await expect(total("Wren Albery")).toHaveText("900.0");
    await page.getByText("Penalties (1)").click();
    const listed = page.getByRole("list", { name: "Penalties" });
    await expect(listed).toContainText("Round 1, Tam Ossory: −100, Launched or flew outside the group's times (F3K.9.5)");
    await expect(listed).toContainText("given on the timekeeper's phone by Ines Varga");

    // The round page: the phone's penalty is listed; Ines gives Wren a penalty (300 by F3K.4.3).
    await page.goto(`/contests/${contestId}/rounds/1`);
    const section = page.getByRole("region", { name: "Penalties" });
    await expect(section.getByRole("listitem", { name: "Penalty, Tam Ossory" })).toContainText("given on the timekeeper's phone by Ines Varga");
    const form = page.getByRole("form", { name: "Give a penalty" });
    // the choice of pilot shows the phone's penalties for that pilot once the page is interactive (a choice made before hydration is lost)
    await expect(async () => {
      await form.getByRole("combobox", { name: "Pilot", exact: true }).selectOption({ label: "Wren Albery (group 1)" });
      await expect(form.getByText("No penalty from a timekeeper's phone for this pilot in this round.")).toBeVisible({ timeout: 1000 });
    }).toPass();
    await form.getByRole("combobox", { name: "For", exact: true }).selectOption({ label: "Model touched a person in a safety area (−300)" });
    await form.getByLabel("Note (optional)").fill("Touched the helper in the launch area");
    await form.getByRole("button", { name: "Give the penalty" }).click();
    const wren = section.getByRole("listitem", { name: "Penalty, Wren Albery" });
    await expect(wren).toContainText("Wren Albery: −300, Model touched a person in a safety area (F3K.4.3)");
    await expect(wren).toContainText("given on the round page by Ines Varga");

    // Typing the phone's penalty again is refused: it counts once.
    await form.getByRole("combobox", { name: "Pilot", exact: true }).selectOption({ label: "Tam Ossory (group 1)" });
    await expect(form.getByText("From the timekeeper's phone already: −100 Launched or flew outside the group's times (F3K.9.5).")).toBeVisible();
    await form.getByRole("combobox", { name: "For", exact: true }).selectOption({ label: "Launched or flew outside the group's times (−100)" });
    await form.getByRole("button", { name: "Give the penalty" }).click();
    await expect(form.getByText("The timekeeper's phone already gave this pilot this penalty in this round; it counts once.", { exact: false })).toBeVisible();

    // Results: Wren 900.0 − 300 = 600.0; Tam still 650.0 (no double count); each penalty listed with who.
    await page.goto(`/contests/${contestId}/results`);
    await expect(total("Wren Albery")).toHaveText("600.0");
    await expect(total("Tam Ossory")).toHaveText("650.0");
    await page.getByText("Penalties (2)").click();
    await expect(listed).toContainText("Round 1, Wren Albery: −300, Model touched a person in a safety area (F3K.4.3)");

    // Removed, saying why: struck through with who removed it; the total returns to 900.0.
    await page.goto(`/contests/${contestId}/rounds/1`);
    await wren.getByLabel("Why it is removed").fill("The helper was Wren's own caller");
    await wren.getByRole("button", { name: "Remove" }).click();
    await expect(wren).toContainText("removed by Ines Varga");
    await expect(wren).toContainText("not counted (removed)");
    await expect(wren.locator(".line-through")).toHaveCount(1);
    await page.goto(`/contests/${contestId}/results`);
    await expect(total("Wren Albery")).toHaveText("900.0");
    await page.getByText("Penalties (2)").click();
    await expect(listed).toContainText("removed by Ines Varga");
  } finally {
    await db.end();
  }
});
