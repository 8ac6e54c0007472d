import { expect, test } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";

/**
 * A timekeeper times a club mate with no signal: the mate's name, offered from the club list
 * the phone kept, links the lane to the mate's account, so once synced the run is in the
 * mate's logbook too, counted once they accept it (the server allows naming people who share a
 * club: lib/sync/authorise.ts).
 */
test.use({ viewport: { width: 390, height: 844 } });
test.describe.configure({ timeout: 120_000 });

test("a partner named from the club list offline gets the run in their own record", async ({ page, context, browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    await signInAs(page, "ada@example.com");
    await page.goto("/field/new"); // with signal: the club list is fetched and kept on the phone
    await workerReady(page);
    await expect
      .poll(() => page.locator("datalist option").evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value)))
      .toContain("Tobi Okafor");

    await context.setOffline(true);
    await page.reload().catch(() => null); // served by the worker; the list comes from IndexedDB
    const field = `Mates Meadow ${Date.now()}`;
    await page.getByLabel("Field").fill(field);
    await page.getByRole("radio", { name: /A partner/ }).check();
    await page.getByLabel("Partner's name").fill("tobi okafor");
    await expect(page.getByText("Club mate: the run goes to Tobi Okafor’s logbook too.")).toBeVisible();
    if (process.env.SHOTS) await page.screenshot({ path: "/tmp/club-mate-page.png" });
    await page.getByRole("radio", { name: /^A · / }).first().check();
    await page.getByRole("button", { name: "Set up the window" }).click();
    await expect(page).toHaveURL(/\/field\/run\?id=/);
    const runId = new URL(page.url()).searchParams.get("id")!;
    await page.getByRole("button", { name: "Start working time" }).click();
    await page.getByRole("button", { name: "Launch, Tobi Okafor" }).click();
    await page.getByRole("button", { name: "Landed, Tobi Okafor" }).click();
    await expect(page.getByRole("button", { name: "Launch, Tobi Okafor" })).toBeVisible();

    await context.setOffline(false); // signal again: the phone sends on its own
    const tobi = (await db.query<{ id: string }>("select id from users where email = 'tobi@example.com'")).rows[0]!.id;
    await expect
      .poll(async () => (await db.query("select pilot_user_id from run_lanes where run_id = $1", [runId])).rows[0]?.pilot_user_id, { timeout: 30_000 })
      .toBe(tobi);
    await expect
      .poll(async () => (await db.query("select count(*)::int as n from events where run_id = $1", [runId])).rows[0].n, { timeout: 30_000 })
      .toBe(3);

    // The mate signs in elsewhere, finds the run in the logbook as recorded by Ada, and once
    // accepted the session counts among their own (README "Runs recorded for you").
    const other = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const tobiPage = await other.newPage();
    await signInAs(tobiPage, "tobi@example.com");
    await expect(tobiPage.getByRole("list", { name: "Recent sessions" })).not.toContainText(field);
    await tobiPage.goto(`/logbook/run?id=${runId}`);
    const recorded = tobiPage.getByRole("group", { name: "Recorded by Ada Fenwick" });
    await expect(recorded).toContainText("Not in your record until you accept it.", { timeout: 30_000 });
    await recorded.getByRole("button", { name: "Accept" }).click();
    await expect(recorded).toContainText("You accepted it");
    await tobiPage.goto("/");
    await expect(tobiPage.getByRole("list", { name: "Recent sessions" })).toContainText(field);
    await other.close();
  } finally {
    await db.end();
  }
});
