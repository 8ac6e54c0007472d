import { expect, test, type Page } from "@playwright/test";
import pg from "pg";
import { v7 as uuidv7 } from "uuid";
import { getCatalogueTask } from "../../lib/tasks";
import { signInAs } from "./support/auth";

/**
 * Runs recorded for someone else (README "Runs recorded for you"): a club mate times a pilot;
 * the pilot finds the runs in the logbook as "recorded by …", pending, and not in their counted
 * record (home's sessions) until they accept one; they dispute the other with a reason the
 * recorder sees. Two fresh accounts in a fresh club keep the demo season's counts untouched.
 */
const PASSWORD = "timed-by-a-club-mate";
test.use({ viewport: { width: 390, height: 844 } });
test.describe.configure({ timeout: 120_000 });

async function signUp(page: Page, name: string, tag: string): Promise<string> {
  const email = `${tag}-${Date.now()}@example.com`;
  const origin = new URL(test.info().project.use.baseURL!).origin; // writes must come from the site (proxy.ts)
  const made = await page.request.post("/api/account/sign-up", { headers: { origin }, data: { name, email, password: PASSWORD } });
  expect(made.ok()).toBe(true);
  return email;
}

/** What the recorder's phone would send after timing the pilot in two windows (tasks A and B), one flight each. */
function recordedWindows(recorderId: string, pilot: { id: string; name: string }, field: string) {
  const t0 = Date.now() - 3_600_000;
  const session = { id: uuidv7(), ownerId: recorderId, fieldName: field, conditions: {}, startedAtWallMs: t0 };
  const deviceId = `e2e-consent-${uuidv7()}`;
  let seq = 0;
  const stamp = (at: number) => ({ wallMs: at, monoMs: at - t0 + 1000, pageId: "e2e-consent", offset: null });
  const runs = [];
  const events = [];
  for (const [i, letter] of (["A", "B"] as const).entries()) {
    const start = t0 + i * 1_800_000;
    const run = { id: uuidv7(), sessionId: session.id, task: getCatalogueTask(letter), lanes: [{ lane: 0, pilotName: pilot.name, pilotUserId: pilot.id }], createdAtWallMs: start - 60_000 };
    runs.push(run);
    for (const [at, body] of [[0, { kind: "window-start" }], [2_000, { kind: "launch", lane: 0 }], [95_000, { kind: "landing", lane: 0 }]] as const) {
      events.push({ id: uuidv7(), runId: run.id, deviceId, seq: ++seq, stamp: stamp(start + at), body });
    }
  }
  return { deviceId, sessions: [session], runs, events };
}

test("a pilot accepts one run a club mate recorded for them, which then counts, and disputes another", async ({ page, browser, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const recorderEmail = await signUp(page, "Quill Harrow", "recorder");
    const pilotEmail = await signUp(page, "Sable Minto", "pilot");
    const idOf = async (email: string) => (await db.query<{ id: string }>("select id from users where email = $1", [email])).rows[0]!.id;
    const [recorderId, pilotId] = [await idOf(recorderEmail), await idOf(pilotEmail)];
    const club = (await db.query<{ id: string }>("insert into clubs (name, slug) values ($1, $2) returning id", ["Consent Test Club", `consent-${Date.now()}`])).rows[0]!.id;
    await db.query("insert into memberships (club_id, user_id) values ($1, $2), ($1, $3)", [club, recorderId, pilotId]);

    // The club mate's phone sends what it timed.
    const field = `Consent Meadow ${Date.now()}`;
    const recorder = await browser.newContext();
    const recorderPage = await recorder.newPage();
    await signInAs(recorderPage, recorderEmail, PASSWORD);
    const pushed = await recorderPage.request.post("/api/sync/push", { data: recordedWindows(recorderId, { id: pilotId, name: "Sable Minto" }, field), headers: { origin: baseURL! } });
    expect(pushed.ok()).toBe(true);
    expect((await pushed.json()).acks.every((a: { status: string }) => a.status === "applied")).toBe(true);

    // The pilot: both runs are in the logbook as recorded by the mate, pending, and home does not count them.
    await signInAs(page, pilotEmail, PASSWORD);
    await expect(page.getByText("No sessions yet.")).toBeVisible();
    await page.goto("/logbook");
    const recorded = page.getByRole("group", { name: /recorded by Quill Harrow$/ });
    await expect(recorded).toHaveCount(2, { timeout: 30_000 });
    await expect(recorded.first()).toContainText("Not in your record until you accept it.");
    await expect(recorded.nth(1)).toHaveAttribute("data-consent", "pending");
    if (process.env.SHOTS) await page.screenshot({ path: "/tmp/consent-logbook.png", fullPage: true });

    await recorded.first().getByRole("button", { name: "Accept" }).click();
    await expect(recorded.first()).toContainText("You accepted it: it counts in your record.");
    await recorded.nth(1).getByRole("button", { name: "Dispute" }).click();
    // No reason: the message is beside the field and nothing is decided.
    await recorded.nth(1).getByRole("button", { name: "Send dispute" }).click();
    await expect(recorded.nth(1).getByLabel(/What is wrong with it/)).toHaveAccessibleDescription("Say briefly what is wrong with the record.");
    await expect(recorded.nth(1)).toHaveAttribute("data-consent", "pending");
    await recorded.nth(1).getByLabel(/What is wrong with it/).fill("My flight was 1:40, not 1:33");
    await recorded.nth(1).getByRole("button", { name: "Send dispute" }).click();
    await expect(recorded.nth(1)).toContainText("You disputed it: it does not count in your record.");
    if (process.env.SHOTS) await page.screenshot({ path: "/tmp/consent-decided.png", fullPage: true });

    // Home's sessions count the accepted run only.
    await page.goto("/");
    const sessions = page.getByRole("list", { name: "Recent sessions" });
    await expect(sessions).toContainText(field);
    await expect(sessions).toContainText("1 run");
    await expect(sessions).not.toContainText("2 runs");
    await expect(sessions).toContainText("tasks A");

    // The recorder sees the decisions, the dispute with its reason.
    await recorderPage.goto("/logbook");
    const decisions = recorderPage.getByRole("list", { name: "Pilots you recorded for" });
    await expect(decisions.filter({ hasText: "disputed" })).toContainText("My flight was 1:40, not 1:33", { timeout: 30_000 });
    await expect(decisions.filter({ hasText: "accepted" })).toHaveCount(1);
    await recorder.close();

    // The pilot hides the disputed run, then finds it with "Show hidden runs" and un-hides it.
    await page.goto("/logbook");
    await recorded.nth(1).getByRole("button", { name: "Hide" }).click();
    await expect(recorded).toHaveCount(1);
    const showHidden = page.getByRole("checkbox", { name: "Show hidden runs (1)" });
    await showHidden.check();
    await expect(recorded).toHaveCount(2);
    const hidden = page.locator('[data-consent="hidden"]');
    await expect(hidden).toContainText("You hid it");
    await hidden.getByRole("button", { name: "Un-hide" }).click();
    await expect(page.getByRole("checkbox", { name: "Show hidden runs (0)" })).toBeChecked();
    await page.getByRole("checkbox", { name: /^Show hidden runs/ }).click(); // off; with nothing hidden the toggle goes
    await expect(recorded).toHaveCount(2); // listed again, waiting for a decision
    await expect(recorded.nth(1)).toHaveAttribute("data-consent", "pending");
    await expect(page.getByRole("checkbox", { name: /^Show hidden runs/ })).toHaveCount(0);
    expect((await db.query("select 1 from lane_consents where pilot_user_id = $1 and status = 'hidden'", [pilotId])).rowCount).toBe(0);
  } finally {
    await db.end();
  }
});

test("the demo pilot Ada finds the runs Tobi timed for her at the club evening, waiting for her", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/logbook");
  const recorded = page.getByRole("group", { name: /recorded by Tobi Okafor$/ });
  await expect(recorded).toHaveCount(2, { timeout: 45_000 });
  for (const g of await recorded.all()) await expect(g.getByRole("button", { name: "Accept" })).toBeVisible();
});
