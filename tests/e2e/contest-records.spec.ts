import { expect, test } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { insertTrialContest } from "./support/contest-db";

/**
 * Issue #15, two records for one pilot and round that disagree: Ines (the demo club's officer)
 * sees the seeded pair of the demo contest's round 1 side by side; in a contest of her own, where a
 * pilot's card was replaced by a second entry, she counts the first one and the results follow it.
 */
test.describe.configure({ timeout: 180_000 });

/** A contest of the demo club: Pax's round 1 counts a card of 120.0 s; an earlier card of 180.0 s waits beside it (task A: last flight). */
async function makeContest(db: pg.Client): Promise<string> {
  const { contestId, round1 } = await insertTrialContest(db, { name: "Records Trial", startsOn: "2027-02-27", drawSeed: 13 });
  const ids: string[] = [];
  for (const [name, tenths] of [["Pax Morrow", 1200], ["Wren Alder", 2400]] as const) {
    const { rows: [e] } = await db.query<{ id: string }>("insert into contest_entries (contest_id, pilot_name, paper) values ($1, $2, true) returning id", [contestId, name]);
    const { rows: [s] } = await db.query<{ id: string }>(
      "insert into group_slots (round_id, group_number, entry_id, paper_flights, signed_at, signed_from, recorded_at) values ($1, 1, $2, $3, now(), 'paper card', now()) returning id",
      [round1, e!.id, JSON.stringify([tenths])],
    );
    ids.push(s!.id);
  }
  await db.query("insert into slot_records (slot_id, paper_flights, recorded_at, signed_at, signed_from) values ($1, '[1800]', now(), now(), 'paper card')", [ids[0]]);
  return contestId;
}

test("an officer compares two records of a pilot side by side and counts one", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const contestId = await makeContest(db);
    const { rows: [demo] } = await db.query<{ id: string }>("select id from contests where name = 'Heronmoor Winter Cup'");
    await signInAs(page, "ines@example.com");

    // The seeded pair: Oren's card entered twice, both shown.
    await page.goto(`/contests/${demo!.id}/rounds/1`);
    const oren = page.getByRole("listitem", { name: "Records, Oren Halloway" });
    await expect(oren.getByRole("group", { name: "Kept record 1, Oren Halloway" })).toContainText("Paper card: 98.4 211.3");
    await expect(oren.getByRole("group", { name: "Counting record, Oren Halloway" })).toContainText("Paper card");

    // Her own contest: Pax's counting card says 120.0 s (2:00.0), the kept one 180.0 s (3:00.0).
    await page.goto(`/contests/${contestId}/rounds/1`);
    const pax = page.getByRole("listitem", { name: "Records, Pax Morrow" });
    await expect(pax).toContainText("the records disagree");
    await expect(pax.getByRole("group", { name: "Counting record, Pax Morrow" })).toContainText("Counts now: 2:00.0");
    const kept = pax.getByRole("group", { name: "Kept record 1, Pax Morrow" });
    await expect(kept).toContainText("Kept: 3:00.0");
    await kept.getByRole("button", { name: "Count this one" }).click();
    await expect(page.getByText("No pilot has two records waiting for a decision.")).toBeVisible();

    // Results: Pax 180.0 / Wren 240.0 × 1000 = 750.0 (F3K.9.1), computed by hand.
    await page.goto(`/contests/${contestId}/results`);
    const row = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Pax Morrow" }) }).first();
    await expect(row.getByRole("cell").nth(1)).toHaveText("750.0");
  } finally {
    await db.end();
  }
});
