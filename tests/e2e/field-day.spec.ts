import AxeBuilder from "@axe-core/playwright";
import { expect, test, type BrowserContext, type Page } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";
import { openMail } from "./support/mail";

/**
 * Issue #14, the field day end to end. Ines (the demo club's officer) opens today's day at Five
 * Acre Meadow. Ada and Tobi time each other there with no signal, each on their own phone; Tobi's
 * phone clock runs 15 minutes slow. Back online, each phone syncs on its own, and the Day board
 * puts both runs on one timeline — on the corrected clock, so Tobi's run is not 15 minutes early —
 * with who timed whom, each phone's clock offset and the lift timeline. An officer of another
 * club gets 404 on the board.
 */
const SKEW_MS = -15 * 60_000;
const FIELD = "Five Acre Meadow";
test.describe.configure({ timeout: 240_000 });
test.use({ viewport: { width: 360, height: 800 } });

async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).analyze();
  return results.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

const partnerOf: Record<string, string> = { "ada@example.com": "Tobi Okafor", "tobi@example.com": "Ada Fenwick" };

/** One phone: signed in, the club list fetched with signal (so the partner is offered offline), the worker ready. */
async function phone(context: BrowserContext, email: string, skewMs = 0): Promise<Page> {
  const page = await context.newPage();
  if (skewMs !== 0) await page.clock.install({ time: Date.now() + skewMs }); // runs at the true rate, behind
  await signInAs(page, email);
  await page.goto("/field/new");
  await workerReady(page);
  await expect
    .poll(() => page.locator("datalist option").evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value)))
    .toContain(partnerOf[email]);
  return page;
}

/** Offline: sets up a one-pilot window for the partner at the field and times one flight; returns the run id. */
async function timePartner(page: Page, partner: string): Promise<string> {
  await page.getByLabel("Field").fill(FIELD);
  await page.getByRole("radio", { name: /A partner/ }).check();
  await page.getByLabel("Partner's name").fill(partner);
  await expect(page.getByText(`Club mate: the run goes to ${partner}’s logbook too.`)).toBeVisible();
  await page.getByRole("radio", { name: /^A · / }).first().check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const runId = new URL(page.url()).searchParams.get("id")!;
  await page.getByRole("button", { name: "Start working time" }).click();
  await page.getByRole("button", { name: `Launch, ${partner}` }).click();
  await page.waitForTimeout(2500);
  await page.getByRole("button", { name: `Landed, ${partner}` }).click();
  await expect(page.getByRole("button", { name: `Launch, ${partner}` })).toBeVisible();
  return runId;
}

test("an officer opens a day; two members time each other offline with clocks 15 min apart; the Day board shows both on one timeline", async ({ browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const contexts: BrowserContext[] = [];
  const context = async () => {
    const c = await browser.newContext({ viewport: { width: 360, height: 800 } });
    contexts.push(c);
    return c;
  };
  try {
    const today = new Date().toISOString().slice(0, 10);
    const boardUrl = `/clubs/heronmoor/days/${today}`;

    // The officer opens today's day at the club's home field from the club page.
    const officer = await (await context()).newPage();
    await signInAs(officer, "ines@example.com");
    await officer.goto("/clubs/heronmoor");
    await officer.getByText("Open a field day").click();
    await officer.getByLabel("Field", { exact: true }).selectOption({ label: FIELD });
    await officer.getByLabel("Day", { exact: true }).fill(today);
    await officer.getByRole("button", { name: "Open the day" }).click();
    await expect(officer).toHaveURL(new RegExp(`${boardUrl}$`));
    await expect(officer.getByRole("heading", { name: /^Field day, / })).toBeVisible();
    expect((await db.query("select 1 from club_days d join clubs c on c.id = d.club_id where c.slug = 'heronmoor' and d.day = $1", [today])).rowCount).toBe(1);

    // Two phones at the field: Ada's clock is right, Tobi's runs 15 minutes slow. No signal.
    const adaContext = await context();
    const tobiContext = await context();
    const ada = await phone(adaContext, "ada@example.com");
    const tobi = await phone(tobiContext, "tobi@example.com", SKEW_MS);
    await adaContext.setOffline(true);
    await tobiContext.setOffline(true);
    const tobisRun = await timePartner(ada, "Tobi Okafor"); // Ada holds the watch for Tobi …
    const adasRun = await timePartner(tobi, "Ada Fenwick"); // … then Tobi for Ada

    // Signal again: each phone sends on its own.
    await adaContext.setOffline(false);
    await tobiContext.setOffline(false);
    for (const runId of [tobisRun, adasRun]) {
      await expect
        .poll(async () => (await db.query("select count(*)::int as n from events where run_id = $1 and kind in ('window-start','launch','landing')", [runId])).rows[0].n, { timeout: 60_000 })
        .toBe(3);
      await expect
        .poll(async () => (await db.query("select result_tenths from run_lanes where run_id = $1", [runId])).rows[0]?.result_tenths ?? null, { timeout: 30_000 })
        .not.toBeNull();
    }
    // Tobi's phone stamped its taps 15 minutes behind Ada's; the server measured and corrected that.
    const { rows: starts } = await db.query<{ run_id: string; wall_ms: number; corrected_ms: number }>(
      "select run_id, wall_ms, corrected_ms from events where run_id = any($1::uuid[]) and kind = 'window-start'", [[tobisRun, adasRun]],
    );
    const adaStart = starts.find((s) => s.run_id === tobisRun)!;
    const tobiStart = starts.find((s) => s.run_id === adasRun)!;
    expect(tobiStart.wall_ms - adaStart.wall_ms).toBeLessThan(SKEW_MS + 5 * 60_000); // raw: Tobi's is "earlier"
    expect(tobiStart.corrected_ms).toBeGreaterThan(adaStart.corrected_ms); // corrected: he started after Ada

    // The officer's Day board: both runs on one timeline, in the order they were flown.
    await officer.reload();
    const runs = officer.getByRole("list", { name: "Runs of the day" });
    const adaTimedTobi = runs.locator(`li[data-run-id="${tobisRun}"]`);
    const tobiTimedAda = runs.locator(`li[data-run-id="${adasRun}"]`);
    await expect(adaTimedTobi).toContainText("Tobi Okafor:");
    await expect(adaTimedTobi).toContainText("timed by Ada Fenwick");
    await expect(tobiTimedAda).toContainText("Ada Fenwick:");
    await expect(tobiTimedAda).toContainText("timed by Tobi Okafor");
    const ids = await runs.locator(":scope > li").evaluateAll((items) => items.map((li) => li.getAttribute("data-run-id")));
    expect(ids.indexOf(tobisRun)).toBeLessThan(ids.indexOf(adasRun));
    const times = await Promise.all([adaTimedTobi, tobiTimedAda].map(async (li) => Date.parse((await li.locator("time").getAttribute("datetime"))!)));
    expect(times[1]! - times[0]!).toBeGreaterThan(0);
    expect(times[1]! - times[0]!).toBeLessThan(5 * 60_000); // not 15 minutes apart the wrong way: one corrected timeline
    expect(Math.abs(times[0]! - Date.now())).toBeLessThan(15 * 60_000);

    await expect(officer.getByRole("list", { name: "Who timed whom" })).toContainText("Ada Fenwick timed Tobi Okafor");
    await expect(officer.getByRole("list", { name: "Who timed whom" })).toContainText("Tobi Okafor timed Ada Fenwick");
    const clocks = officer.getByRole("table", { name: "Clock offsets" });
    await expect(clocks.getByRole("row", { name: /Tobi Okafor’s phone/ }).first()).toContainText(/1[45] min .* s behind/);
    await expect(officer.getByTestId("lift-sentence")).toContainText(/^\d+ flights? (from|in the quarter hour from) /);
    await expect(officer.getByTestId("lift-strip")).toBeVisible();
    await expect(officer.getByRole("table", { name: /Flights and lift by quarter hour/ })).toBeAttached();
    expect(await seriousViolations(officer)).toEqual([]);
    if (process.env.SHOTS) await officer.screenshot({ path: "/tmp/field-day-board.png", fullPage: true });

    // A member of another club gets 404 on the board, and on its data.
    const stranger = await (await context()).newPage();
    await signInAs(stranger, "oren@example.com");
    const res = await stranger.goto(boardUrl);
    expect(res?.status()).toBe(404);
    await expect(stranger.getByRole("heading", { name: "Not found" })).toBeVisible();
    expect((await stranger.request.get(`/api/clubs/heronmoor/days/${today}`)).status()).toBe(404);
  } finally {
    for (const c of contexts) await c.close();
    await db.end();
  }
});

test("a member asks for day summaries on the club page; the officer closes a seeded day and the summary reaches her mailbox", async ({ browser }) => {
  const member = await (await browser.newContext()).newPage();
  await signInAs(member, "lena@example.com");
  await member.goto("/clubs/heronmoor");
  const toggle = member.getByRole("checkbox", { name: "E-mail me the summary of each field day when it is closed" });
  await expect(toggle).not.toBeChecked();
  await toggle.check();
  await expect(toggle).toBeChecked();
  await member.reload();
  await expect(toggle).toBeChecked(); // kept on the server

  // The club evening the seed opened (Tobi timed Ada): the officer closes it from its Day board.
  const officer = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(officer, "ines@example.com");
  await officer.goto("/clubs/heronmoor");
  await officer.getByRole("list", { name: "Field days" }).getByRole("link", { name: /21 Nov 2026/ }).click();
  await expect(officer).toHaveURL(/\/clubs\/heronmoor\/days\/2026-11-21$/);
  await expect(officer.getByRole("list", { name: "Who timed whom" })).toContainText("Tobi Okafor timed Ada Fenwick: 2 windows");
  expect(await seriousViolations(officer)).toEqual([]);
  await officer.getByRole("button", { name: "Close the day and send the summary" }).click();
  await expect(officer.getByText(/^Closed\. The summary goes to 1 member who asked for it\.$/)).toBeVisible();

  const mail = await openMail(member, /Heronmoor Hand-Launch Club: the field day of Sat 21 Nov 2026/, "lena@example.com");
  await expect(mail).toContainText("Best in task");
  await expect(mail).toContainText("To stop these e-mails, open");
  await member.context().close();
  await officer.context().close();
});
