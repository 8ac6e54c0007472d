import { expect, test, type BrowserContext } from "@playwright/test";
import Papa from "papaparse";
import pg from "pg";
import { signInAs } from "./support/auth";
import { insertTrialContest } from "./support/contest-db";
import { workerReady } from "./support/field";

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
    await expect(page.getByRole("alert").filter({ hasText: /^Nothing was drawn/ })).toHaveText("Nothing was drawn: the results entered so far are kept.");
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

test("an officer names a re-flight's timekeeper; her phone times it offline, pilot and timekeeper sign, and the re-flight stands", async ({ browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const contexts: BrowserContext[] = [];
  const context = async () => {
    const c = await browser.newContext({ viewport: { width: 390, height: 844 } });
    contexts.push(c);
    return c;
  };
  try {
    const contestId = await makeContest(db);
    const { rows: [contest] } = await db.query<{ name: string }>("select name from contests where id = $1", [contestId]);
    // Pax's round 1 (a signed 150.0 s on paper) was rained on: he re-flies with his group at the end of the round
    await db.query(`insert into contest_reflights (round_id, entry_id, cause, placement, group_number, granted_by)
      select r.id, e.id, 'rain', 'original-group', 1, (select id from users where email = 'ines@example.com')
      from contest_rounds r, contest_entries e where r.contest_id = $1 and r.number = 1 and e.contest_id = $1 and e.pilot_name = 'Pax Morrow'`, [contestId]);

    const officer = await (await context()).newPage();
    await signInAs(officer, "ines@example.com");
    await officer.goto(`/contests/${contestId}/rounds/1`);
    const item = officer.getByRole("listitem", { name: "Re-flight, Pax Morrow" });
    const keeper = item.getByRole("form", { name: "Re-flight timekeeper, Pax Morrow" });
    await keeper.getByLabel("Timekeeper of Pax Morrow's re-flight").selectOption({ label: "Mara Lindqvist" });
    await keeper.getByRole("button", { name: "Save the timekeeper" }).click();
    await expect(keeper).toContainText("Timed on Mara Lindqvist's phone");

    // Mara's phone syncs: the re-flight duty arrives; offline, one tap sets up Pax's lane.
    const maraContext = await context();
    const mara = await maraContext.newPage();
    await signInAs(mara, "mara@example.com");
    await mara.goto("/field");
    await workerReady(mara);
    const duty = mara.getByRole("article", { name: "Contest: re-flight, round 1, group 1 — pilot Pax Morrow" }).filter({ hasText: contest!.name });
    await expect(duty).toBeVisible({ timeout: 30_000 });
    await maraContext.setOffline(true);
    await duty.getByRole("button", { name: /^Set up the re-flight, round 1, group 1: one lane/ }).click();
    await expect(mara).toHaveURL(/\/field\/run\?id=/);
    const runId = new URL(mara.url()).searchParams.get("id")!;
    await mara.getByRole("button", { name: "Start working time" }).click();
    await mara.getByRole("button", { name: /^Launch, .*Pax Morrow/ }).first().click();
    await mara.waitForTimeout(2000);
    await mara.getByRole("button", { name: /^Landed, .*Pax Morrow/ }).first().click();
    await expect(mara.getByRole("button", { name: /^Launch, .*Pax Morrow/ }).first()).toBeVisible();
    await mara.getByText("End this window early").click();
    await mara.getByRole("button", { name: "Close the window now" }).click();
    await expect(mara.getByRole("heading", { name: "Contest: sign the results" })).toBeVisible();
    const lane = mara.getByRole("listitem", { name: "Signature, Pax Morrow" });
    await lane.getByLabel("Pax Morrow: I agree with this result").check();
    await lane.getByLabel("Mara Lindqvist: I timed it").check();
    await lane.getByRole("button", { name: "Sign Pax Morrow's result" }).click();
    await expect(lane.getByRole("status")).toContainText("Signed by Pax Morrow and Mara Lindqvist at");

    // Signal again: the lane is the re-flight's result (not the slot's), signed on the phone.
    await maraContext.setOffline(false);
    await expect.poll(async () => (await db.query(
      "select g.signed_from from contest_reflights g join contest_rounds r on r.id = g.round_id where r.contest_id = $1 and g.run_id = $2", [contestId, runId],
    )).rows[0]?.signed_from ?? null, { timeout: 60_000 }).toBe("on the phone: pilot Pax Morrow, timekeeper Mara Lindqvist");
    const { rows: [slot] } = await db.query("select s.run_id, s.paper_flights from group_slots s join contest_entries e on e.id = s.entry_id where e.contest_id = $1 and e.pilot_name = 'Pax Morrow'", [contestId]);
    expect(slot).toMatchObject({ run_id: null, paper_flights: [1500] });
    const { rows: [timed] } = await db.query<{ result_tenths: number }>("select result_tenths from run_lanes where run_id = $1 and lane = 0", [runId]);
    expect(timed!.result_tenths).toBeGreaterThan(0);

    // Results: with the original group the re-flight stands even if worse (F3K.9.6); Wren's 200.0 s is the group's best,
    // so Pax scores his re-flight ÷ 200.0 × 1000 (F3K.9.1), computed here.
    await officer.goto(`/contests/${contestId}/results`);
    const pax = officer.getByRole("row").filter({ has: officer.getByRole("rowheader", { name: "Pax Morrow" }) }).first();
    await expect(pax.getByRole("cell").nth(1)).toContainText((Math.round((timed!.result_tenths * 10000) / 2000) / 10).toFixed(1));
    await expect(pax.getByRole("cell").nth(1)).toContainText("re-flight stands");
  } finally {
    for (const c of contexts) await c.close();
    await db.end();
  }
});

test("the officer sees a re-flight asked on a timekeeper's phone and grants it (F3K.9.6: the grant is hers)", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const { rows: [demo] } = await db.query<{ id: string }>("select id from contests where name = 'Heronmoor Winter Cup'");
    await signInAs(page, "ines@example.com");
    // the seeded request: Mara's phone ruled a launch collision for round 1's first pilot (who that is follows the draw)
    const { rows: [asked] } = await db.query<{ name: string }>(`select e.pilot_name as name from contest_reflight_requests q join contest_entries e on e.id = q.entry_id
      join contest_rounds r on r.id = q.round_id where r.contest_id = $1 and r.number = 1`, [demo!.id]);
    const pilot = asked!.name;
    await page.goto(`/contests/${demo!.id}/rounds/1`);
    const request = page.getByRole("listitem", { name: `Re-flight request, ${pilot}` });
    await expect(request).toContainText(/asked on the phone by Mara Lindqvist at .+, cause a collision during the launch/);
    await request.getByRole("button", { name: `Grant ${pilot}'s re-flight` }).click();
    await expect(request).toContainText("Granted by Ines Varga");
    await expect(page.getByRole("listitem", { name: `Re-flight, ${pilot}` })).toContainText("Granted by Ines Varga");
    const { rows: [row] } = await db.query("select q.status, g.cause from contest_reflight_requests q join contest_reflights g on g.id = q.reflight_id join contest_rounds r on r.id = q.round_id where r.contest_id = $1", [demo!.id]);
    expect(row).toMatchObject({ status: "granted", cause: "launch-collision" });
  } finally {
    await db.end();
  }
});

test("the officer sees both records of the seeded re-flight side by side, counts the phone's run, and the results follow", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const { rows: [demo] } = await db.query<{ id: string }>("select id from contests where name = 'Heronmoor Winter Cup'");
    const csvOf = async () => Papa.parse<Record<string, string>>(await (await page.request.get(`/api/contests/${demo!.id}/results?format=csv`)).text(), { header: true, skipEmptyLines: true }).data
      .find((r) => r.Pilot === "Bea Quillfeather")!;
    await signInAs(page, "ines@example.com");

    // the seed (db/seed/demo-records.ts): Bea's re-flight card counts; Mara's phone run of it, with other times, waits beside it
    await page.goto(`/contests/${demo!.id}/results`);
    const bea = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Bea Quillfeather" }) }).first();
    await expect(bea).toContainText("two records, not decided yet");
    // task B scores the last two flights (RULES.md, task B): the card 165.5 + 173.0 = 338.5 s, the run 150.6 + 168.4 = 319.0 s (by hand)
    expect((await csvOf())["Re-flights"]).toMatch(/^round 2: original \d+\.\d s, re-flight 338\.5 s: (re-flight|original) counted$/);
    expect((await csvOf()).Note).toContain("round 2 two records, not decided yet");

    await page.goto(`/contests/${demo!.id}/rounds/2`);
    const records = page.getByRole("listitem", { name: "Records, Bea Quillfeather's re-flight" });
    await expect(records).toContainText("the records disagree");
    const counting = records.getByRole("group", { name: "Counting record, Bea Quillfeather's re-flight" });
    await expect(counting).toContainText("Counts now: 5:38.5");
    await expect(counting).toContainText("Paper card: 141.2 165.5 173.0");
    await expect(counting).toContainText("recorded by Ines Varga");
    await expect(counting).toContainText("marked by an officer");
    const kept = records.getByRole("group", { name: "Kept record 1, Bea Quillfeather's re-flight" });
    await expect(kept).toContainText("Kept: 5:19.0");
    // task B counts the last two flights: the first is marked
    await expect(kept).toContainText("Timed run, lane 1: 141.3 (not counted) 150.6 168.4");
    await expect(kept).toContainText("recorded by Mara Lindqvist");
    await expect(kept).toContainText("on the phone: pilot Bea Quillfeather, timekeeper Mara Lindqvist");
    await kept.getByRole("button", { name: "Count this one" }).click();
    await expect(records).toHaveCount(0);
    const { rows: decided } = await db.query<{ outcome: string; who: string }>(
      `select k.outcome, u.name as who from slot_records k join contest_reflights g on g.id = k.reflight_id join contest_rounds r on r.id = g.round_id
       join users u on u.id = k.decided_by where r.contest_id = $1 order by k.outcome`, [demo!.id]);
    expect(decided).toEqual([{ outcome: "counted", who: "Ines Varga" }, { outcome: "set-aside", who: "Ines Varga" }]);

    // the run is the re-flight's result now; which of original and re-flight stands is still F3K.9.6's
    await page.goto(`/contests/${demo!.id}/results`);
    await expect(bea).not.toContainText("two records, not decided yet");
    expect((await csvOf())["Re-flights"]).toMatch(/^round 2: original \d+\.\d s, re-flight 319\.0 s: (re-flight|original) counted$/);
  } finally {
    await db.end();
  }
});
