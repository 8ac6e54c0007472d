import { randomUUID } from "node:crypto";
import { expect, test, type BrowserContext, type Page } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";

/**
 * Issue #15, on the day: Ines (the demo club's officer) makes Mara the timekeeper of two pilots of
 * round 1's group 1. Mara's phone syncs, loses signal, sets up the group's lanes with one tap, times
 * both pilots, and each pilot signs with her on the phone. Back online, the phone syncs; the run is
 * the pilots' official result, and the contest's results show both, signed.
 */
test.describe.configure({ timeout: 240_000 });

const PILOTS = ["Pax Morrow", "Wren Alder"]; // invented; lanes in name order

async function makeContest(db: pg.Client): Promise<string> {
  const today = new Date().toISOString().slice(0, 10);
  const { rows: [club] } = await db.query<{ id: string }>("select id from clubs where slug = 'heronmoor'");
  const { rows: [c] } = await db.query<{ id: string }>(
    "insert into contests (club_id, name, starts_on, field_name, draw_seed) values ($1, $2, $3, 'Five Acre Meadow', 11) returning id",
    [club!.id, `Timekeepers Trial ${randomUUID().slice(0, 6)}`, today],
  );
  // five rounds with the tasks of the seeded demo contest (its stored task definitions)
  const tasks = ["A", "B", "D", "F", "H"];
  let round1 = "";
  for (const [i, letter] of tasks.entries()) {
    const { rows: [r] } = await db.query<{ id: string }>(
      "insert into contest_rounds (contest_id, number, task) select $1, $2, task from contest_rounds where task ->> 'letter' = $3 limit 1 returning id",
      [c!.id, i + 1, letter],
    );
    if (i === 0) round1 = r!.id;
  }
  for (const name of PILOTS) {
    const { rows: [e] } = await db.query<{ id: string }>("insert into contest_entries (contest_id, pilot_name, paper) values ($1, $2, true) returning id", [c!.id, name]);
    await db.query("insert into group_slots (round_id, group_number, entry_id) values ($1, 1, $2)", [round1, e!.id]);
  }
  return c!.id;
}

test("an officer assigns a timekeeper; her phone times the group offline, pilots sign, and the results show it", async ({ browser }) => {
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

    // The officer gives both pilots of group 1 a timekeeper on the round's page.
    const officer: Page = await (await context()).newPage();
    await signInAs(officer, "ines@example.com");
    await officer.goto(`/contests/${contestId}/rounds/1`);
    await expect(officer.getByRole("heading", { name: "Round 1: timekeepers" })).toBeVisible();
    for (const name of PILOTS) await officer.getByLabel(`Timekeeper for ${name}`).selectOption({ label: "Mara Lindqvist" });
    await officer.getByRole("button", { name: "Save group 1's timekeepers" }).click();
    await expect(officer.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();
    await expect(officer.getByText(/^Timed by Mara Lindqvist · assigned by Ines Varga/)).toHaveCount(2);

    // Mara's phone syncs with signal: the duty arrives.
    const maraContext = await context();
    const mara = await maraContext.newPage();
    await signInAs(mara, "mara@example.com");
    await mara.goto("/field");
    await workerReady(mara);
    const duty = mara.getByRole("article", { name: `Contest: round 1, group 1 — pilots ${PILOTS.join(", ")}` }).filter({ hasText: "Timekeepers Trial" });
    await expect(duty).toBeVisible({ timeout: 30_000 });

    // No signal at the field: one tap sets up the lanes, named.
    await maraContext.setOffline(true);
    await duty.getByRole("button", { name: /^Set up round 1, group 1: 2 lanes/ }).click();
    await expect(mara).toHaveURL(/\/field\/run\?id=/);
    const runId = new URL(mara.url()).searchParams.get("id")!;
    await mara.getByRole("button", { name: "Start working time" }).click();
    for (const [i, name] of PILOTS.entries()) {
      await mara.getByRole("button", { name: new RegExp(`^Launch, .*${name}`) }).first().click();
      await mara.waitForTimeout(1500 + i * 1000);
      await mara.getByRole("button", { name: new RegExp(`^Landed, .*${name}`) }).first().click();
      await expect(mara.getByRole("button", { name: new RegExp(`^Launch, .*${name}`) }).first()).toBeVisible();
    }
    await mara.getByText("End this window early").click();
    await mara.getByRole("button", { name: "Close the window now" }).click();

    // Each pilot and the timekeeper sign on the phone, still offline.
    await expect(mara.getByRole("heading", { name: "Contest: sign the results" })).toBeVisible();
    for (const name of PILOTS) {
      const lane = mara.getByRole("listitem", { name: `Signature, ${name}` });
      await lane.getByLabel(`${name}: I agree with this result`).check();
      await lane.getByLabel("Mara Lindqvist: I timed it").check();
      await lane.getByRole("button", { name: `Sign ${name}'s result` }).click();
      await expect(lane.getByRole("status")).toContainText(`Signed by ${name} and Mara Lindqvist at`);
    }

    // Signal again: the phone syncs; the lanes are the pilots' slots, signed.
    await maraContext.setOffline(false);
    await expect.poll(async () => (await db.query(
      "select count(*)::int as n from group_slots g join contest_rounds r on r.id = g.round_id where r.contest_id = $1 and g.run_id = $2 and g.signed_at is not null",
      [contestId, runId],
    )).rows[0].n, { timeout: 60_000 }).toBe(2);
    const { rows: lanes } = await db.query<{ pilot_name: string; result_tenths: number }>("select pilot_name, result_tenths from run_lanes where run_id = $1 order by lane", [runId]);
    expect(lanes.map((l) => l.pilot_name)).toEqual(PILOTS);
    for (const l of lanes) expect(l.result_tenths).toBeGreaterThan(0);

    // The contest's results: each pilot's points come from the run's result (run_lanes.result_tenths), signed;
    // per group, points = result ÷ best × 1000 (F3K.9.1), computed here independently.
    await officer.goto(`/contests/${contestId}/results`);
    const best = Math.max(...lanes.map((l) => l.result_tenths));
    for (const l of lanes) {
      const row = officer.getByRole("row").filter({ has: officer.getByRole("rowheader", { name: l.pilot_name }) }).first();
      await expect(row.getByRole("cell").nth(1)).toHaveText((Math.round((l.result_tenths * 10000) / best) / 10).toFixed(1));
      await expect(row).not.toContainText("unsigned");
    }
    await officer.getByText(/^Signatures \(2\)/).click();
    const signatures = officer.getByRole("list", { name: "Signatures" });
    for (const name of PILOTS) await expect(signatures).toContainText(`${name}: signed`);
    await expect(signatures).toContainText("on the phone: pilot Wren Alder, timekeeper Mara Lindqvist");
  } finally {
    for (const c of contexts) await c.close();
    await db.end();
  }
});
