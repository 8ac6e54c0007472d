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

/** Zones without summer time, one per offset from UTC−11 to UTC+12 (IANA names). */
const STEADY_ZONES = [
  "Pacific/Pago_Pago", "Pacific/Honolulu", "Pacific/Gambier", "Pacific/Pitcairn", "America/Phoenix", "America/Regina", "America/Bogota", "America/La_Paz",
  "America/Sao_Paulo", "America/Noronha", "Atlantic/Cape_Verde", "UTC", "Africa/Lagos", "Africa/Johannesburg", "Africa/Nairobi", "Asia/Dubai", "Asia/Karachi",
  "Asia/Dhaka", "Asia/Bangkok", "Asia/Singapore", "Asia/Tokyo", "Australia/Brisbane", "Pacific/Noumea", "Pacific/Tarawa",
];
const localHour = (ms: number, zone: string) => Number(new Intl.DateTimeFormat("en-GB", { hour: "2-digit", hourCycle: "h23", timeZone: zone }).format(ms));
const localDay = (ms: number, zone: string) => new Intl.DateTimeFormat("en-CA", { year: "numeric", month: "2-digit", day: "2-digit", timeZone: zone }).format(ms);
/** A zone where it is between 10:00 and 14:59 now: hours from either midnight. */
const middayZone = (ms: number) => STEADY_ZONES.find((z) => localHour(ms, z) >= 10 && localHour(ms, z) <= 14)!;

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
    // The club's clock is set to a zone where it is now mid-day, so the day cannot turn over while the
    // test runs, whatever the wall clock's date (the zones' offsets are read through Intl, not assumed).
    const zone = middayZone(Date.now());
    const today = localDay(Date.now(), zone);
    const boardUrl = `/clubs/heronmoor/days/${today}`;

    // The officer sets the club's time zone, then opens today's day at the club's home field from the club page.
    const officer = await (await context()).newPage();
    await signInAs(officer, "ines@example.com");
    await officer.goto("/clubs/heronmoor");
    await officer.getByText("Set the club's time zone").click();
    await officer.getByLabel("Time zone", { exact: true }).selectOption(zone);
    await officer.getByRole("button", { name: "Save the time zone" }).click();
    await expect(officer.getByTestId("club-time-zone")).toHaveText(zone);
    expect((await db.query("select time_zone from clubs where slug = 'heronmoor'")).rows[0].time_zone).toBe(zone);
    await officer.getByText("Open a field day").click();
    await officer.getByLabel("Field", { exact: true }).selectOption({ label: FIELD });
    await officer.getByLabel("Day", { exact: true }).fill(today);
    await officer.getByRole("button", { name: "Open the day" }).click();
    await expect(officer).toHaveURL(new RegExp(`${boardUrl}$`));
    await expect(officer.getByRole("heading", { name: /^Field day, / })).toBeVisible();
    expect((await db.query("select 1 from club_days d join clubs c on c.id = d.club_id where c.slug = 'heronmoor' and d.day = $1", [today])).rowCount).toBe(1);
    // The club page lists the day once: under what is coming, not again among the past days.
    await officer.goto("/clubs/heronmoor");
    await expect(officer.getByRole("list", { name: "Coming days and contests" }).locator(`a[href="${boardUrl}"]`)).toHaveCount(1);
    await expect(officer.locator(`a[href="${boardUrl}"]`)).toHaveCount(1);

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
    await officer.goto(boardUrl);
    await expect(officer.getByText(`times in ${zone}, on the corrected clock`)).toBeVisible();
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
    await db.query("update clubs set time_zone = 'UTC' where slug = 'heronmoor'");
    await db.end();
  }
});

test("a member asks for day summaries on the club page; the officer closes a seeded day and the summary reaches her mailbox", async ({ browser }) => {
  const member = await (await browser.newContext()).newPage();
  await signInAs(member, "lena@example.com");
  await member.goto("/clubs/heronmoor");
  const toggle = member.getByRole("checkbox", { name: "E-mail me the summary of each field day when it is closed" });
  await expect(toggle).not.toBeChecked();
  // the box follows the click at once; reload only once the server answered (a reload would cut the request off)
  const saved = member.waitForResponse((r) => r.url().endsWith("/api/clubs/heronmoor/day-summaries") && r.request().method() === "PUT");
  await toggle.check();
  await expect(toggle).toBeChecked();
  expect((await saved).status()).toBe(200);
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
  await expect(officer.getByTestId("day-closed")).toContainText(/^Closed on \d{1,2} \w{3} \d{4}, \d{2}:\d{2} by Ines /);
  await officer.reload();
  await expect(officer.getByRole("button", { name: "Close the day and send the summary" })).toHaveCount(0);
  await expect(officer.getByTestId("day-closed")).toContainText("phones that sync later change nothing here");

  const mail = await openMail(member, /Heronmoor Hand-Launch Club: the field day of Sat 21 Nov 2026/, "lena@example.com");
  await expect(mail).toContainText("Best in task");
  await expect(mail).toContainText("To stop these e-mails, open");
  await member.context().close();
  await officer.context().close();
});

test("Ada's run page says the evening's Day board counts another record for her lane: whose, both results, who decided and when, the board", async ({ browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  let runId = "";
  let runResult = "";
  try {
    // the seeded decision (db/seed/field-days.ts): the backup phone's record counts on the evening's board
    const { rows } = await db.query<{ run_id: string; result: string }>(`
      select x.run_id, to_char(l.result_tenths / 10.0, 'FM999990.0') as result from club_day_decisions x
      join run_lanes l on l.run_id = x.run_id and l.lane = x.lane where x.device_id = 'demo-phone-tobi' and x.day = '2026-11-21'`);
    runId = rows[0]!.run_id;
    runResult = rows[0]!.result;
  } finally {
    await db.end();
  }
  const ada = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(ada, "ada@example.com");
  await ada.goto(`/logbook/run?id=${runId}`);
  const note = ada.getByTestId("day-decision");
  await expect(note).toContainText("Heronmoor Hand-Launch Club, field day of Sat 21 Nov 2026: the Day board counts Tobi Okafor’s phone’s record (…e-tobi):", { timeout: 30_000 });
  await expect(note).toContainText(`there; this run’s result is ${runResult} s.`);
  await expect(ada.getByTestId("lane-result-0")).toHaveText(`${runResult} s`); // the run's own result stays beside it
  const board = (await note.textContent())!.match(/\(…e-tobi\): (\d+\.\d) s there/)![1]!;
  expect(Number(board)).toBeLessThan(Number(runResult)); // the backup missed her last flight
  await expect(note).toContainText(/Decided by Ines \S+ on \w{3},? 2[12] Nov 2026, \d{2}:\d{2} \S+\. Note: Ada called her last launch a test throw before the horn\./);
  // the whole run page: its flights tables scroll in a focusable region (ScrollRegion), which axe flagged before
  const axe = await new AxeBuilder({ page: ada }).analyze();
  expect(axe.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => v.id)).toEqual([]);
  await note.getByRole("link", { name: "Open the Day board" }).click();
  await expect(ada).toHaveURL(/\/clubs\/heronmoor\/days\/2026-11-21$/);
  const lane = ada.getByRole("list", { name: "Runs of the day" }).locator(`[data-run-id="${runId}"] li`).filter({ hasText: "Ada Fenwick" });
  await expect(lane).toContainText(`Ada Fenwick: ${board} s, `);
  await expect(lane).toContainText("the record an officer chose for this day");
  await ada.context().close();

  // an officer of another club who asks learns nothing of it
  const stranger = await (await browser.newContext()).newPage();
  await signInAs(stranger, "oren@example.com");
  const answer = await stranger.evaluate(async (id) => (await fetch(`/api/runs/${id}/day-decisions`)).json(), runId);
  expect(answer).toEqual({ decisions: [] });
  await stranger.context().close();
});

test("an officer sees the seeded evening's lane two phones recorded differently, side by side, and decides which record stands", async ({ browser }) => {
  const officer = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
  await signInAs(officer, "ines@example.com");
  await officer.goto("/clubs/heronmoor/days/2026-11-21");
  const pairs = officer.getByRole("list", { name: "Runs recorded differently" });
  await expect(pairs.getByRole("listitem").filter({ hasText: "Ada Fenwick" })).toHaveCount(1);
  const pair = pairs.locator(":scope > li").first();
  // both phones' versions: Tobi's club timing phone and his own, on which he missed the last flight (the seed):
  // whose each is, its result, its flights on the corrected clock and its clock
  const club = pair.locator('[data-device-id="demo-phone-tobi-club"]');
  const backup = pair.locator('[data-device-id="demo-phone-tobi"]');
  await expect(club).toContainText("Tobi Okafor’s phone …i-club");
  await expect(backup).toContainText("Tobi Okafor’s phone …e-tobi");
  // the seed's decision: the backup's record stands for the day (db/seed/field-days.ts)
  await expect(backup).toContainText(/Result \d+\.\d s, \d+ flights? · used/);
  await expect(club).toContainText(/Result \d+\.\d s, \d+ flights?/);
  await expect(club).not.toContainText("· used");
  await expect(pair.getByTestId("decision")).toContainText("the record on Tobi Okafor’s phone …e-tobi stands");
  const clubFlights = await club.getByRole("list").locator("li").count();
  expect(await backup.getByRole("list").locator("li").count()).toBe(clubFlights - 1);
  await expect(club.getByRole("list").locator("li").first()).toContainText(/^\d{2}:\d{2}:\d{2}\.\d → \d{2}:\d{2}:\d{2}\.\d$/);
  await expect(club).toContainText(/Clock (on time|\d)/);
  expect(await seriousViolations(officer)).toEqual([]);

  const form = pair.getByRole("form", { name: /^Decision, Ada Fenwick, / });
  // the seeded choice of the backup's record: it is the day's result for the lane (one flight fewer), marked, and "used"
  const runId = await pair.getAttribute("data-run-id");
  const lane = officer.getByRole("list", { name: "Runs of the day" }).locator(`[data-run-id="${runId}"] li`).filter({ hasText: "Ada Fenwick" });
  await expect(lane).toContainText(`, ${clubFlights - 1} flight`);
  await expect(lane).toContainText("the record an officer chose for this day");
  // then the club phone's record (the one the rules had chosen)
  await form.getByRole("radio", { name: /^The record on Tobi Okafor’s phone …i-club/ }).check();
  await form.getByRole("textbox", { name: "Note", exact: true }).fill("The backup phone missed the last landing.");
  await form.getByRole("button", { name: "Record the decision" }).click();
  await expect(pair.getByTestId("decision")).toContainText(/^Decided by Ines [^:]+ on \d{1,2} \w{3} \d{4}, \d{2}:\d{2}: /);
  await expect(pair.getByTestId("decision")).toContainText("the record on Tobi Okafor’s phone …i-club stands. Note: The backup phone missed the last landing.");
  await expect(lane).toContainText(`, ${clubFlights} flight`);
  await expect(club).toContainText("· used");
  await expect(backup).not.toContainText("· used");
  await officer.reload();
  await expect(officer.getByTestId("decision")).toContainText("the record on Tobi Okafor’s phone …i-club stands");

  // a member sees the decision but gets no form; the server refuses her a decision (403)
  const member = await (await browser.newContext()).newPage();
  await signInAs(member, "lena@example.com");
  await member.goto("/clubs/heronmoor/days/2026-11-21");
  await expect(member.getByTestId("decision")).toContainText("the record on Tobi Okafor’s phone …i-club stands");
  await expect(member.getByRole("form", { name: /^Decision, / })).toHaveCount(0);
  const refused = await member.evaluate(async () => {
    const res = await fetch("/api/clubs/heronmoor/days/2026-11-21/decisions", {
      method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ runId: "00000000-0000-4000-8000-000000000000", lane: 0, deviceId: null, note: "mine" }),
    });
    return { status: res.status, body: (await res.json()) as { error: { message: string } } };
  });
  expect(refused).toEqual({ status: 403, body: { error: expect.objectContaining({ message: "Only the club's officers may do this." }) } });
  await member.context().close();
  await officer.context().close();
});

test("a pilot puts an older run of hers in a field day from the run page, and sees it on that day's board", async ({ browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    // one of Ada's seeded season runs at the home field, on a date the day after which the club has no field day yet
    const { rows } = await db.query<{ id: string; day: string }>(`
      select r.id, to_char((r.created_at at time zone 'UTC')::date + 1, 'YYYY-MM-DD') as day
      from runs r join field_sessions s on s.id = r.session_id join users u on u.id = r.created_by
      where u.email = 'ada@example.com' and s.field_name = 'Five Acre Meadow'
        and not exists (select 1 from club_days d where d.day between (r.created_at at time zone 'UTC')::date - 8 and (r.created_at at time zone 'UTC')::date + 8)
      order by r.created_at desc limit 1`);
    const run = rows[0]!;
    const boardUrl = `/clubs/heronmoor/days/${run.day}`;

    const officer = await (await browser.newContext()).newPage();
    await signInAs(officer, "ines@example.com");
    await officer.goto("/clubs/heronmoor");
    await officer.getByText("Open a field day").click();
    await officer.getByLabel("Field", { exact: true }).selectOption({ label: FIELD });
    await officer.getByLabel("Day", { exact: true }).fill(run.day);
    await officer.getByRole("button", { name: "Open the day" }).click();
    await expect(officer).toHaveURL(new RegExp(`${boardUrl}$`));
    await expect(officer.locator(`li[data-run-id="${run.id}"]`)).toHaveCount(0); // flown the day before: not the day's

    const ada = await (await browser.newContext({ viewport: { width: 360, height: 800 } })).newPage();
    await signInAs(ada, "ada@example.com");
    await ada.goto(`/logbook/run?id=${run.id}`);
    const choice = ada.getByRole("checkbox", { name: new RegExp(`^Heronmoor Hand-Launch Club: ${FIELD}, ${run.day}$`) });
    await expect(choice).not.toBeChecked({ timeout: 30_000 });
    await choice.click(); // the box shows what the server holds: checked once the choice is stored and read back
    await expect(choice).toBeChecked({ timeout: 15_000 });
    await ada.reload();
    await expect(choice).toBeChecked({ timeout: 30_000 }); // kept on the server

    await ada.goto(boardUrl);
    await expect(ada.getByRole("list", { name: "Runs of the day" }).locator(`li[data-run-id="${run.id}"]`)).toContainText("Ada Fenwick:");
    await ada.context().close();
    await officer.context().close();
  } finally {
    await db.end();
  }
});
