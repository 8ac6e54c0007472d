import { expect, test } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { insertTrialContest } from "./support/contest-db";

/**
 * Issue #15, re-flights recorded by officers (F3K.9.6): Ines (the demo club's officer) sees the
 * seeded re-flight of the demo contest's round 2 with who granted it; in a contest of her own she
 * grants a pilot a re-flight with the original group (rain), enters its paper card, and the results
 * show the re-flight's result standing even though it is worse, with the grant listed.
 */
test.describe.configure({ timeout: 180_000 });

const PILOTS: [string, number][] = [["Pax Morrow", 1500], ["Wren Alder", 2000]]; // invented; signed paper cards of task A, tenths

async function makeContest(db: pg.Client): Promise<string> {
  const { contestId, round1 } = await insertTrialContest(db, { name: "Re-flight Trial", startsOn: "2027-02-20", drawSeed: 12 });
  for (const [name, tenths] of PILOTS) {
    const { rows: [e] } = await db.query<{ id: string }>("insert into contest_entries (contest_id, pilot_name, paper) values ($1, $2, true) returning id", [contestId, name]);
    await db.query(
      "insert into group_slots (round_id, group_number, entry_id, paper_flights, signed_at, signed_from, recorded_at) values ($1, 1, $2, $3, now(), 'paper card', now())",
      [round1, e!.id, JSON.stringify([tenths])],
    );
  }
  return contestId;
}

test("an officer grants a re-flight, enters its card, and the results follow F3K.9.6", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const contestId = await makeContest(db);
    const { rows: [demo] } = await db.query<{ id: string }>("select id from contests where name = 'Heronmoor Winter Cup'");
    await signInAs(page, "ines@example.com");

    // The seeded re-flight: listed on round 2's page with why and who granted it.
    await page.goto(`/contests/${demo!.id}/rounds/2`);
    const seeded = page.getByRole("listitem", { name: "Re-flight, Bea Quillfeather" });
    await expect(seeded).toContainText("the organiser's fault");
    await expect(seeded).toContainText("Granted by Ines Varga");
    await expect(seeded.getByLabel("Re-flight times of Bea Quillfeather")).toHaveValue("141.2 165.5 173.0");

    // Her own contest: Pax's round 1 (150.0 s) was rained on; the group flies again at the end of the round.
    await page.goto(`/contests/${contestId}/rounds/1`);
    const grant = page.getByRole("form", { name: "Grant a re-flight" });
    await grant.getByLabel("Pilot").selectOption({ label: "Pax Morrow (group 1)" });
    await grant.getByLabel("Why").selectOption({ label: "rain" });
    await grant.getByLabel("Where it is flown").selectOption({ label: "with the original group at the end of the round" });
    await expect(grant).toContainText("the re-flight's result stands, even if worse");
    await grant.getByLabel("Note (optional)").fill("Shower over the field");
    await grant.getByRole("button", { name: "Grant the re-flight" }).click();
    const item = page.getByRole("listitem", { name: "Re-flight, Pax Morrow" });
    await expect(item).toContainText("rain, with the original group at the end of the round (group 1)");
    await expect(item).toContainText("Granted by Ines Varga");

    // The re-flight's paper card: 100.0 s, signed.
    await item.getByLabel("Re-flight times of Pax Morrow").fill("100.0");
    await expect(item).toContainText("Re-flight result 1:40.0");
    await item.getByLabel("Re-flight signed (Pax Morrow)").check();
    await item.getByRole("button", { name: "Save Pax Morrow's re-flight" }).click();
    await expect(item.getByLabel("Re-flight signed (Pax Morrow)")).toBeChecked();
    await expect.poll(async () => (await db.query("select signed_at from contest_reflights r join contest_entries e on e.id = r.entry_id where e.pilot_name = 'Pax Morrow' and e.contest_id = $1", [contestId])).rows[0]?.signed_at ?? null).not.toBeNull();

    // Results: the re-flight stands even if worse (F3K.9.6): Pax 100.0 / Wren's best 200.0 × 1000 = 500.0 (F3K.9.1), computed by hand.
    await page.goto(`/contests/${contestId}/results`);
    const pax = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Pax Morrow" }) }).first();
    await expect(pax.getByRole("cell").nth(1)).toContainText("500.0");
    await expect(pax.getByRole("cell").nth(1)).toContainText("re-flight stands");
    await page.getByText(/^Re-flights \(1\)/).click();
    await expect(page.getByRole("list", { name: "Re-flights" })).toContainText("Round 1, Pax Morrow: rain, with the original group at the end of the round (group 1); granted by Ines Varga");
  } finally {
    await db.end();
  }
});

test("drawing again asks first when results would be deleted, and keeps them on no", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const contestId = await makeContest(db); // two signed paper cards in round 1, the draw not locked
    const held = async () => Number((await db.query("select count(*) from group_slots s join contest_rounds r on r.id = s.round_id where r.contest_id = $1 and s.paper_flights is not null", [contestId])).rows[0].count);
    await signInAs(page, "ines@example.com");
    await page.goto(`/contests/${contestId}`);
    const asked: string[] = [];
    page.once("dialog", (d) => { asked.push(d.message()); void d.dismiss(); });
    await page.getByRole("button", { name: "Draw again" }).click();
    await expect(page.getByRole("alert")).toHaveText("Nothing was drawn: the results entered so far are kept.");
    expect(asked).toEqual(["2 results are already entered in the preliminary rounds (paper cards, timed runs or signatures). A new draw deletes them: nothing was drawn. Confirm to draw again anyway."]);
    expect(await held()).toBe(2);
    page.once("dialog", (d) => void d.accept());
    await page.getByRole("button", { name: "Draw again" }).click();
    await expect.poll(held).toBe(0);
    await expect(page.getByText(/^Seed \d+$/)).not.toHaveText("Seed 12");
  } finally {
    await db.end();
  }
});
