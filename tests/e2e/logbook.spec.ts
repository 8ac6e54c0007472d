import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { getCatalogueTask } from "../../lib/tasks";
import { signInAs } from "./support/auth";

/**
 * The logbook reads only the phone's IndexedDB. A run recorded on this phone is put there
 * with the raw IndexedDB API in the shape lib/offline stores (no test-only path in the app),
 * then the pages are read as a pilot would.
 *
 * The run, task H (1, 2, 3 and 4 minute targets, any order; 10 min), worked by hand:
 *   flight 1  0:01.0 → 4:02.3 (landing 4:02.35)   241.35 s → 241.3 s (truncated, F3K.7), matched 240 → adds 240.0, capped
 *   flight 2  4:03.0 → 7:04.0                     181.0 s, matched 180 → adds 180.0, capped
 *   flight 3  7:05.0 → 9:00.9, corrected to 9:00.5 115.5 s, matched 120 → adds 115.5
 *   flight 4  9:01.0 → 9:59.0                      58.0 s, matched 60 → adds 58.0
 *   result 240 + 180 + 115.5 + 58 = 593.5 s; the most H can score is 600 − 4 = 596.0 s (F3K.7
 *   sum cap, RULES.md "H: at most 596 s"); lost 2.5 s = 1.3 + 1.0 s flown beyond targets
 *   + 0.2 s on the ground beyond the one second per scored flight.
 */
const T0 = Date.UTC(2026, 4, 2, 9, 0, 0);
const ids = (n: number) => `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`;
const SESSION = ids(900);
const RUN = ids(901);
const DEVICE = "e2e-phone-0001";

function fixture() {
  const session = { id: SESSION, ownerId: "e2e-pilot", fieldName: "Long Meadow", conditions: { windMs: 3.5, gustMs: 6, notes: "thermals from noon" }, startedAtWallMs: T0 - 600_000 };
  const run = { id: RUN, sessionId: SESSION, task: getCatalogueTask("H"), lanes: [{ lane: 0, pilotName: "Ada" }], createdAtWallMs: T0 - 60_000 };
  const bodies: [number, object][] = [
    [0, { kind: "window-start" }],
    [1_000, { kind: "launch", lane: 0 }],
    [242_350, { kind: "landing", lane: 0 }],
    [243_000, { kind: "launch", lane: 0 }],
    [424_000, { kind: "landing", lane: 0 }],
    [425_000, { kind: "launch", lane: 0 }],
    [540_900, { kind: "landing", lane: 0 }],
    [541_000, { kind: "launch", lane: 0 }],
    [599_000, { kind: "landing", lane: 0 }],
    [620_000, { kind: "correct", targetId: ids(7), wallMs: T0 + 540_500 }],
    [625_000, { kind: "penalty", lane: 0, points: 100, reason: "touched a person in the safety area" }],
    [640_000, { kind: "run-end" }],
  ];
  const events = bodies.map(([at, body], i) => ({
    id: ids(i + 1),
    runId: RUN,
    deviceId: DEVICE,
    seq: i + 1,
    stamp: { wallMs: T0 + at, monoMs: 1000 + at, pageId: "e2e-page", offset: null },
    body,
  }));
  const older = { id: ids(899), ownerId: "e2e-pilot", fieldName: "Quarry Field", conditions: {}, startedAtWallMs: T0 - 8 * 86_400_000 };
  return { sessions: [older, session], run, events };
}

/** Puts the fixture into the app's own database (opened by the page first, so its stores exist). */
async function storeRun(page: Page) {
  await page.evaluate(async (data) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open("windowcall");
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const tx = db.transaction(["sessions", "runs", "events"], "readwrite");
    for (const s of data.sessions) tx.objectStore("sessions").put(s);
    tx.objectStore("runs").put(data.run);
    for (const e of data.events) tx.objectStore("events").put(e);
    await new Promise<void>((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
    });
    db.close();
  }, fixture());
}

async function seriousViolations(page: Page) {
  const { violations } = await new AxeBuilder({ page }).analyze();
  return violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

// The demo season would arrive by sync pull and race the fixture; the logbook needs no
// network anyway, so sync is cut off and the phone's database holds only what the test puts there.
// The service worker is kept out: it would send /api requests itself, where routes cannot see them.
test.use({ viewport: { width: 390, height: 844 }, serviceWorkers: "block" });

test.beforeEach(async ({ page }) => {
  await page.route("**/api/sync/**", (route) => route.abort());
});

test("the logbook is empty at first, then lists the stored session with its run and result", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/logbook");
  await expect(page.getByText("Nothing in the logbook on this phone yet.")).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);

  await storeRun(page);
  await page.reload();
  const sessions = page.getByRole("list", { name: "Sessions" }).locator(":scope > li");
  await expect(sessions.getByRole("heading", { level: 2 })).toHaveText(["Sat, 2 May 2026", "Fri, 24 Apr 2026"]); // newest first
  await expect(sessions.nth(1)).toContainText("Quarry Field");
  await expect(sessions.nth(1)).toContainText("No conditions noted");
  await expect(sessions.nth(1)).toContainText("No runs in this session.");
  const session = sessions.first();
  await expect(session).toContainText("Long Meadow");
  await expect(session).toContainText("wind 3.5 m/s, gusts 6 · thermals from noon");
  const runLink = session.getByRole("link", { name: /H · 1, 2, 3 and 4 minute target flight times/ });
  await expect(runLink).toContainText("593.5 s");
  expect(await seriousViolations(page)).toEqual([]);
  if (process.env.SHOTS) await page.screenshot({ path: "/tmp/logbook-list.png", fullPage: true });
});

test("the run page shows the flights, the result, the breakdown summing to the loss, the strip and the corrections", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/logbook");
  await expect(page.getByText("Nothing in the logbook on this phone yet.")).toBeVisible();
  await storeRun(page);
  await page.goto(`/logbook/run?id=${RUN}`);

  await expect(page.getByRole("heading", { level: 1 })).toHaveText("H · 1, 2, 3 and 4 minute target flight times, any order");
  await expect(page.getByTestId("lane-result-0")).toHaveText("593.5 s");
  const rows = page.getByRole("table", { name: "Flights, Ada" }).locator("tbody tr");
  await expect(rows).toHaveCount(4);
  await expect(page.getByTestId("flight-time")).toHaveText(["241.3", "181.0", "115.5", "58.0"]);
  await expect(rows.nth(0)).toContainText("0:01.0");
  await expect(rows.nth(0)).toContainText("4:02.3");
  await expect(rows.nth(0)).toContainText("counts, capped");
  await expect(rows.nth(2)).toContainText("9:00.5"); // the corrected landing

  await expect(page.getByTestId("breakdown-max")).toHaveText("596.0 s");
  await expect(page.getByTestId("breakdown-scored")).toHaveText("593.5 s");
  await expect(page.getByTestId("breakdown-lost")).toHaveText("2.5 s");
  await expect(page.locator('[data-part="overCap"] td')).toHaveText("2.3 s");
  await expect(page.locator('[data-part="groundTime"] td')).toHaveText("0.2 s");
  await expect(page.getByTestId("breakdown-sum")).toHaveText("2.5 s = lost");
  await expect(page.getByTestId("breakdown-penalty")).toContainText("−100 points");

  const strip = page.getByTestId("timeline-strip");
  await expect(strip.locator("[data-flight]")).toHaveCount(4);
  await expect(strip.locator("[data-target]")).toHaveCount(4);
  await expect(page.locator("figcaption")).toContainText("flight 1 from 0:01.0 for 241.3 s, counts, capped, for the 4:00 target.");

  const corrections = page.getByRole("list", { name: "Corrections" }).getByRole("listitem");
  await expect(corrections).toHaveCount(2);
  await expect(corrections.nth(0)).toContainText("Moved the landing of Ada by −0.4 s");
  await expect(corrections.nth(1)).toContainText("Penalty −100 points for Ada");
  await expect(page.getByTestId("versions-pending")).toBeVisible();

  expect(await seriousViolations(page)).toEqual([]);
  if (process.env.SHOTS) {
    await page.screenshot({ path: "/tmp/logbook-run-outdoor.png", fullPage: true });
    await page.evaluate(() => (document.documentElement.dataset.theme = "dark"));
    await page.screenshot({ path: "/tmp/logbook-run-dark.png", fullPage: true });
    expect(await seriousViolations(page)).toEqual([]);
  }
});
