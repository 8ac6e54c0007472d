import { expect, test, type Page } from "@playwright/test";
import pg from "pg";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";
import { storedFieldNames } from "./support/stored";

/**
 * One phone, two accounts (a club's timing phone): each account records into its own device
 * database with its own device id, so what one account left unsent is neither pushed under the
 * other's session (which the server refuses: a device belongs to one user) nor listed to it,
 * and it goes to the server when its own account signs in again.
 */
const PASSWORD = "one-phone-two-pilots";
test.describe.configure({ timeout: 120_000 });
// No service worker: it would send /api requests itself, where the blocked push could not be seen.
test.use({ viewport: { width: 390, height: 844 }, serviceWorkers: "block" });

async function signUp(page: Page, name: string, tag: string): Promise<string> {
  const email = `${tag}-${Date.now()}@example.com`;
  const made = await page.request.post("/api/account/sign-up", { headers: { origin: new URL(test.info().project.use.baseURL!).origin }, data: { name, email, password: PASSWORD } });
  expect(made.status()).toBe(201);
  return email;
}

/** Sets up a solo window of task A at `field`, starts it and flies one flight; returns the run id. */
async function flyOneFlight(page: Page, field: string): Promise<string> {
  await page.goto("/field/new");
  await page.getByLabel("Field").fill(field);
  await page.getByRole("radio", { name: /^A · / }).first().check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const runId = new URL(page.url()).searchParams.get("id")!;
  await page.getByRole("button", { name: "Start working time" }).click();
  await page.getByRole("button", { name: /^Launch, / }).click();
  await page.getByRole("button", { name: /^Landed, / }).click();
  await expect(page.getByRole("button", { name: /^Launch, / })).toBeVisible();
  return runId;
}

/** Signs out from the settings; with unsent records, the pilot is told how many and keeps them. */
async function signOut(page: Page, unsent = 0) {
  await page.goto("/settings");
  await page.getByRole("button", { name: "Sign out" }).click();
  if (unsent > 0) {
    const warning = page.getByRole("alertdialog");
    await expect(warning).toContainText(`${unsent} records not sent yet`);
    await expect(warning).toContainText("sent when you sign in here again");
    await warning.getByRole("button", { name: "Sign out and keep them" }).click();
  }
  await expect(page).toHaveURL(/\/sign-in$/);
}

/** The banner's count of records not yet sent, once it shows at least `atLeast` (it follows the outbox a moment later). */
async function unsentCount(page: Page, atLeast: number): Promise<number> {
  let count = 0;
  await expect
    .poll(async () => {
      count = Number((await page.getByRole("banner").innerText()).match(/(\d+) (?:unsent|waiting)/)?.[1] ?? 0); // "3 unsent", or offline "Offline — 3 waiting"
      return count;
    })
    .toBeGreaterThanOrEqual(atLeast);
  return count;
}

test("two accounts on one phone keep their own records, and nothing unsent is lost or refused", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const eventsOf = async (runId: string) =>
    (await db.query<{ device_id: string; user_id: string }>(
      "select e.device_id, d.user_id from events e join devices d on d.id = e.device_id where e.run_id = $1",
      [runId],
    )).rows;
  const userIdOf = async (email: string) => (await db.query<{ id: string }>("select id from users where email = $1", [email])).rows[0]!.id;
  try {
    const first = await signUp(page, "Oona Reed", "first");
    const second = await signUp(page, "Bram Teller", "second");

    // The first account flies with the server unreachable for pushes: its records stay unsent.
    await signInAs(page, first, PASSWORD);
    await page.route("**/api/sync/push", (route) => route.abort());
    const firstRun = await flyOneFlight(page, "Shared Phone Meadow");
    const unsent = await unsentCount(page, 5); // the session, the run and three taps, all kept unsent
    await signOut(page, unsent); // told how many, and they are kept
    await page.unroute("**/api/sync/push");

    // The second account, same browser: its own records reach the server under its own device.
    await signInAs(page, second, PASSWORD);
    const secondRun = await flyOneFlight(page, "Borrowed Phone Strip");
    await expect.poll(async () => (await eventsOf(secondRun)).length, { timeout: 30_000 }).toBeGreaterThanOrEqual(3);
    const secondEvents = await eventsOf(secondRun);
    expect(new Set(secondEvents.map((e) => e.user_id))).toEqual(new Set([await userIdOf(second)]));
    // … nothing of the first account's was sent with them, and the second is not shown it.
    expect(await eventsOf(firstRun)).toEqual([]);
    await page.goto("/logbook");
    await expect(page.getByRole("main")).toContainText("Borrowed Phone Strip");
    await expect(page.getByRole("main")).not.toContainText("Shared Phone Meadow");
    await expect(page.getByRole("banner")).toContainText("Synced");
    await expect(page.getByRole("banner")).toContainText("Refused by the server (0)");
    await signOut(page);

    // The first account returns: what it left unsent goes now, under its own device, refused by nobody.
    await signInAs(page, first, PASSWORD);
    await expect.poll(async () => (await eventsOf(firstRun)).length, { timeout: 30_000 }).toBeGreaterThanOrEqual(3);
    const firstEvents = await eventsOf(firstRun);
    expect(new Set(firstEvents.map((e) => e.user_id))).toEqual(new Set([await userIdOf(first)]));
    const devices = [firstEvents[0]!.device_id, secondEvents[0]!.device_id];
    expect(devices[0]).not.toBe(devices[1]);
    const { rows: refused } = await db.query(
      "select 1 from sync_rejections where device_id = any($1)",
      [devices],
    );
    expect(refused).toEqual([]);
    await page.goto("/logbook");
    await expect(page.getByRole("main")).toContainText("Shared Phone Meadow");
    await expect(page.getByRole("main")).not.toContainText("Borrowed Phone Strip");
  } finally {
    await db.end();
  }
});

test("an account handed another's database (site storage partly cleared) moves to one of its own", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const first = await signUp(page, "Cato Brin", "kept");
    const second = await signUp(page, "Dara Holt", "cleared");
    await signInAs(page, first, PASSWORD);
    const firstRun = await flyOneFlight(page, "Cleared Storage Field");
    await expect.poll(async () => (await db.query("select 1 from events where run_id = $1", [firstRun])).rowCount, { timeout: 30_000 }).toBe(3);
    await signOut(page);
    await page.evaluate(() => localStorage.clear()); // IndexedDB is kept: the next account is handed the first one's database

    await signInAs(page, second, PASSWORD);
    await page.goto("/logbook");
    await expect(page.getByRole("main")).toContainText("Nothing in the logbook on this phone yet.");
    const secondRun = await flyOneFlight(page, "Fresh Start Strip");
    await expect.poll(async () => (await db.query("select 1 from events where run_id = $1", [secondRun])).rowCount, { timeout: 30_000 }).toBe(3);
    const { rows } = await db.query<{ email: string }>(
      "select distinct u.email from events e join devices d on d.id = e.device_id join users u on u.id = d.user_id where e.run_id = $1",
      [secondRun],
    );
    expect(rows.map((r) => r.email)).toEqual([second]);
  } finally {
    await db.end();
  }
});

test.describe("with the service worker", () => {
  test.use({ serviceWorkers: "allow" });

  test("after sign-out, the next person on the phone sees none of the account's records, offline included", async ({ page, context }) => {
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    try {
      const first = await signUp(page, "Runa Falk", "leaving");
      await signInAs(page, first, PASSWORD);
      await workerReady(page);
      const run = await flyOneFlight(page, "Private Meadow");
      await expect.poll(async () => (await db.query("select 1 from events where run_id = $1", [run])).rowCount, { timeout: 30_000 }).toBe(3);
      await expect(page.getByRole("banner")).toContainText("Synced");
      await page.goto("/"); // rendered with the account's name and sessions, kept in the worker's page cache
      await expect(page.getByRole("heading", { name: "Hello, Runa" })).toBeVisible();
      await page.goto("/logbook");
      await expect(page.getByRole("main")).toContainText("Private Meadow");
      await signOut(page); // nothing unsent: no question asked

      // The next person picks the phone up with no signal.
      await context.setOffline(true);
      await page.goto("/logbook").catch(() => null);
      await expect(page.getByRole("main")).toContainText("Nothing in the logbook on this phone yet.");
      await expect(page.getByRole("main")).not.toContainText("Private Meadow");
      await page.goto("/").catch(() => null);
      await expect(page.getByRole("heading", { name: "No signal" })).toBeVisible(); // the cached home page is gone
      await expect(page.locator("body")).not.toContainText("Runa");
      const stored = await storedFieldNames(page);
      expect(stored).not.toContain("Private Meadow");

      // Back online, another account signs in: it is not shown the first one's records either.
      await context.setOffline(false);
      const second = await signUp(page, "Sten Ovid", "arriving");
      await signInAs(page, second, PASSWORD);
      await page.goto("/logbook");
      await expect(page.getByRole("main")).toContainText("Nothing in the logbook on this phone yet.");
    } finally {
      await db.end();
    }
  });

  test("signed out with no signal, the session ends at the first request that reaches the server", async ({ page, context }) => {
    const email = await signUp(page, "Ilse Marr", "offline-out");
    await signInAs(page, email, PASSWORD);
    await workerReady(page);
    await page.goto("/settings");
    await expect(page.getByRole("region", { name: "Account" })).toContainText(email);
    await context.setOffline(true);
    await page.getByRole("button", { name: "Sign out", exact: true }).click();
    await expect(page).toHaveURL(/\/sign-in$/);
    // The sign-out did not wait for the server: the session cookie is still there, and with it the mark
    // that a sign-out is pending. (Chromium's offline emulation now and then lets one request through;
    // if it did, the proxy has already ended the session: both cookies are gone, never just one.)
    const names = (await context.cookies()).map((c) => c.name);
    expect(names.includes("next-auth.session-token")).toBe(names.includes("windowcall-sign-out-pending"));

    // Signal again, the next person opens the app: no signed-in page is shown on the old session.
    await context.setOffline(false);
    await page.goto("/");
    await expect(page).toHaveURL(/\/sign-in/);
    await expect(page.locator("body")).not.toContainText("Ilse");
    expect(await page.evaluate(async () => (await fetch("/api/auth/session")).json())).toEqual({});
    expect((await context.cookies()).map((c) => c.name)).not.toContain("next-auth.session-token");
    // and the account signs in again as usual (the finished sign-out leaves nothing pending)
    await signInAs(page, email, PASSWORD);
    await page.goto("/settings");
    await expect(page.getByRole("region", { name: "Account" })).toContainText(email);
  });
});
