import { randomBytes } from "node:crypto";
import { expect, test } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { insertTrialContest } from "./support/contest-db";

/**
 * Issue #15, disputes recorded by officers: Ines (the demo club's officer) sees the demo contest's
 * disputes on its page (one upheld by a re-flight, one open) and the open one marked on the results; in
 * a contest of her own she records a team manager's protest on the round's page, the results and the
 * public link (signed out, no names) show the result under dispute, she rejects it with an outcome and
 * the mark goes.
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
