import { expect, test } from "@playwright/test";
import pg from "pg";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";
import { press, workerReady } from "./support/field";

/**
 * Two phones, one window (SYNC.md §4): phone A gives the working-time signal, phone B — whose
 * clock runs 15 minutes slow — times the flights. Both are offline while it happens. Back online,
 * the server puts both phones' taps on one timeline with the clock offsets each phone measured
 * (RFC 5905 §8) and must score what one correct clock would: B's flights, launched seconds after
 * the signal. Trusting B's wall clock as-is would put every launch 15 minutes before the signal,
 * and launches before working time score zero (F3K.6).
 */
const SKEW_MS = -15 * 60_000;
const PASSWORD = "two-phones-one-window";
test.describe.configure({ timeout: 180_000 });
test.use({ viewport: { width: 390, height: 844 } });

function pause(ms: number) {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

test("a signal on one phone and flights on another, clocks 15 min apart, score as on one clock", async ({ browser, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const phoneA = await browser.newContext();
    const phoneB = await browser.newContext();
    const a = await phoneA.newPage();
    const b = await phoneB.newPage();
    await b.clock.install({ time: Date.now() + SKEW_MS }); // runs at the true rate, 15 min behind

    const email = `pair-${Date.now()}@example.com`;
    const made = await a.request.post("/api/account/sign-up", { headers: sameOrigin(baseURL), data: { name: "Pia Marsh", email, password: PASSWORD } });
    expect(made.status()).toBe(201);
    for (const page of [a, b]) {
      await signInAs(page, email, PASSWORD);
      await workerReady(page);
    }

    // Phone A sets up a G window (five longest flights, F3K.11.7); it reaches the server.
    await a.goto("/field/new");
    await a.getByLabel("Field").fill("Long Acre");
    await a.getByRole("radio", { name: /^G · Five longest/ }).check();
    await a.getByRole("button", { name: "Set up the window" }).click();
    await expect(a).toHaveURL(/\/field\/run\?id=/);
    const runId = new URL(a.url()).searchParams.get("id")!;
    await expect.poll(async () => (await db.query("select 1 from runs where id = $1", [runId])).rowCount, { timeout: 30_000 }).toBe(1);

    // Phone B pulls it and opens it as the flight timer.
    const link = b.locator(`a[href="/field/run?id=${runId}"]`);
    await expect
      .poll(async () => {
        await b.goto("/field");
        // the page pulls once it has settled (components/sync/when-settled.ts): give each load that long
        await link.waitFor({ timeout: 10_000 }).catch(() => undefined);
        return link.count();
      }, { timeout: 45_000 })
      .toBe(1);
    await link.click();
    await b.getByRole("button", { name: /Signal given on another phone/ }).click();
    const launchB = b.getByRole("button", { name: /^Launch, / });
    await expect(launchB).toBeVisible();
    await expect(a.getByRole("button", { name: "Start working time" })).toBeVisible();

    // No signal at the field.
    await phoneA.setOffline(true);
    await phoneB.setOffline(true);
    const signal = await press(a, a.getByRole("button", { name: "Start working time" }));
    await expect(a.getByTestId("working-time-left")).toBeVisible();
    await pause(2000);
    const launch1 = await press(b, launchB);
    await expect(b.getByRole("button", { name: /^Landed, / })).toBeVisible();
    await pause(3000);
    await press(b, b.getByRole("button", { name: /^Landed, / }));
    await expect(launchB).toBeVisible();
    await pause(1000);
    await press(b, launchB);
    await pause(4000);
    await press(b, b.getByRole("button", { name: /^Landed, / }));
    await expect(launchB).toBeVisible();

    // Signal is back: both phones push on their own (the `online` event), measuring their clocks again.
    await phoneA.setOffline(false);
    await phoneB.setOffline(false);
    await expect
      .poll(async () => (await db.query("select count(*)::int as n from events where run_id = $1 and kind in ('window-start','launch','landing')", [runId])).rows[0].n, { timeout: 45_000 })
      .toBe(5);

    const { rows: ev } = await db.query(
      "select kind, device_id, wall_ms, corrected_ms, uncertainty_ms from events where run_id = $1 and kind in ('window-start','launch','landing') order by wall_ms",
      [runId],
    );
    const start = ev.find((e) => e.kind === "window-start")!;
    const taps = ev.filter((e) => e.kind !== "window-start").sort((x, y) => x.corrected_ms - y.corrected_ms);
    expect(new Set(taps.map((t) => t.device_id)).size).toBe(1);
    expect(taps[0].device_id).not.toBe(start.device_id);
    // The raw wall clocks disagree by the injected 15 minutes …
    expect(taps[0].wall_ms - start.wall_ms).toBeLessThan(SKEW_MS + 10_000);
    // … the corrected times agree with the real time between the two presses, within the measured bound.
    const gap = taps[0].corrected_ms - start.corrected_ms;
    const slack = 250 + (taps[0].uncertainty_ms ?? 0) + (start.uncertainty_ms ?? 0);
    expect(gap).toBeGreaterThan(launch1.before - signal.after - slack);
    expect(gap).toBeLessThan(launch1.after - signal.before + slack);

    // The result a single correct clock gives: each flight as timed on phone B, truncated to 0.1 s (F3K.7).
    const flights = [0, 2].map((i) => taps[i + 1].wall_ms - taps[i].wall_ms);
    const expected = flights.reduce((sum, ms) => sum + Math.trunc(ms / 100), 0);
    await expect
      .poll(async () => (await db.query("select result_tenths from run_lanes where run_id = $1 and lane = 0", [runId])).rows[0]?.result_tenths, { timeout: 30_000 })
      .not.toBeNull();
    const { rows: lanes } = await db.query("select result_tenths, needs_review from run_lanes where run_id = $1", [runId]);
    const nearBoundary = flights.some((ms) => ms % 100 < 5 || ms % 100 > 95); // a re-corrected ms could cross a tenth
    if (nearBoundary) expect(Math.abs(lanes[0].result_tenths - expected)).toBeLessThanOrEqual(1);
    else expect(lanes[0].result_tenths).toBe(expected);
    expect(lanes[0].result_tenths).toBeGreaterThan(60); // ≥ 3 s + 4 s flown: never the zero of an uncorrected clock
    expect(lanes[0].needs_review).toBe(false);
  } finally {
    await db.end();
  }
});
