import { expect, test, type BrowserContext, type Page } from "@playwright/test";
import { openNewWindow, press, settle, storedEvents, workerReady } from "./support/field";

/**
 * The field timer in a real Chromium with the real service worker, offline after the first
 * load, on Playwright's controlled clock (it fakes Date, performance.now, timers and frames).
 */

// Tomorrow 09:00 UTC: later than every seeded or earlier run, so the field home lists it first.
const T0 = new Date((Math.floor(Date.now() / 86_400_000) + 1) * 86_400_000 + 9 * 3_600_000);
test.use({ viewport: { width: 390, height: 844 } });
test.describe.configure({ timeout: 240_000 }); // long fake windows on a busy 2-core machine

/** Waits until the sync layer has kept the signed-in profile on the device (for offline use). */
async function profileCached(page: Page) {
  await expect
    .poll(() =>
      page.evaluate(
        () =>
          new Promise<boolean>((resolve) => {
            const req = indexedDB.open("windowcall");
            req.onsuccess = () => {
              const get = req.result.transaction("meta").objectStore("meta").get("profile");
              get.onsuccess = () => resolve(Boolean(get.result));
              get.onerror = () => resolve(false);
            };
            req.onerror = () => resolve(false);
          }),
      ),
    )
    .toBe(true);
}

/**
 * Signs in once online, lets the worker take control and the profile be cached, then cuts
 * the network, installs the controlled clock and opens the set-up form from the precache.
 */
async function openSetUpOffline(page: Page, context: BrowserContext) {
  await openNewWindow(page, {
    email: "ada@example.com",
    t0: T0, // paused from here: time moves only by runFor, so every reading below is exact
    offline: true,
    warmUpMs: 1_000, // let the page's timers run once before pausing
    beforeForm: async () => {
      await workerReady(page);
      await profileCached(page);
      await context.setOffline(true);
    },
  });
}

async function chooseTaskH(page: Page, group?: string[]) {
  await page.getByLabel("Field").fill("North Meadow");
  if (group) {
    await page.getByRole("radio", { name: /Several pilots/ }).check();
    for (const [i, name] of group.entries()) await page.getByLabel(`Pilot in lane ${i + 1}`).fill(name);
  }
  await page.getByRole("radio", { name: /^H · 1, 2, 3 and 4 minute/ }).check();
}

/** A real touch-like press (trusted pointerdown) without Playwright's frame-based waiting. */
/** Redraw now: the screen re-reads the clocks when the page becomes visible. */
async function redraw(page: Page) {
  await page.evaluate(() => document.dispatchEvent(new Event("visibilitychange")));
}

/** Creates the window and gives the start signal; returns the fake ms spent after the signal. */
async function createAndStart(page: Page): Promise<number> {
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const start = page.getByRole("button", { name: "Start working time" });
  await settle(page, start, 50);
  await press(page, start);
  const spent = await settle(page, page.getByTestId("working-time-left"), 1);
  await expect(page.getByTestId("working-time-left")).toHaveText("10:00");
  return spent;
}

/** Presses a lane's control and waits until the write is stored and drawn (the word flips). */
async function tap(page: Page, lane: string, from: "Launch" | "Landed") {
  await press(page, page.getByRole("button", { name: `${from}, ${lane}` }));
  await expect(page.getByRole("button", { name: `${from === "Launch" ? "Landed" : "Launch"}, ${lane}` })).toBeVisible();
}

/** Flies a lane's script: [wait ms, from] pairs, each a runFor then a tap. */
async function fly(page: Page, steps: [string, number, "Launch" | "Landed"][]) {
  for (const [lane, waitMs, from] of steps) {
    if (waitMs > 0) await page.clock.runFor(waitMs);
    await tap(page, lane, from);
  }
}

test("solo H offline: four flights, a reload mid-flight, exact result (F3K.11.8)", async ({ page, context }) => {
  await openSetUpOffline(page, context);
  await chooseTaskH(page);
  await createAndStart(page);
  // The solo lane is named after the signed-in pilot.
  const me = (await page.getByRole("button", { name: /^Launch, / }).getAttribute("aria-label"))!.replace(/^Launch, /, "");
  // F3K.11.8 example flights 63, 239, 182, 90 s; each relaunch 0.3 s after the landing (no debounce).
  await fly(page, [
    [me, 1_000, "Launch"], // 1.0
    [me, 63_000, "Landed"], // 64.0 → 63.0 s
    [me, 300, "Launch"], // 64.3
  ]);
  await page.clock.runFor(85_700); // 150.0 s into the window, 85.7 s into flight 2
  await page.reload().catch(() => null); // offline: the worker serves the shell; the run comes from IndexedDB
  const spent = await settle(page, page.getByTestId("working-time-left"), 1);
  await redraw(page);
  await expect(page.getByTestId("flight-clock-0")).toHaveText("1:25.7");
  await expect(page.getByTestId("working-time-left")).toHaveText("7:30");
  await fly(page, [
    [me, 153_300 - spent, "Landed"], // 303.3 → 239.0 s
    [me, 300, "Launch"], // 303.6
    [me, 182_000, "Landed"], // 485.6 → 182.0 s
    [me, 300, "Launch"], // 485.9
    [me, 90_000, "Landed"], // 575.9 → 90.0 s
  ]);
  await expect(page.getByTestId("result-0")).toHaveText("569.0");
  await page.clock.runFor(60_000); // past the landing window
  await press(page, page.getByRole("button", { name: "Close the window and see the result" }));
  // F3K.11.8: 60 + 239 + 180 + 90 = 569.0 s.
  await expect(page.getByTestId("final-result-0")).toHaveText("569.0 s");
  // Points lost, worked by hand: H's maximum is the F3K.7 sum cap 600 − 4 = 596.0 s, so
  // 27.0 s are lost = 5.0 s flown beyond targets (63.0 against 60, 182.0 against 180) +
  // 22.0 s on the ground (600 − 574.0 s airtime = 26.0 s, less the 4 × 1 s F3K.7 allows).
  const result = page.getByRole("listitem", { name: /^Result, / });
  await expect(result).toContainText("of 596.0 s possible · 27.0 s lost");
  await expect(result.locator("[data-part=groundTime]")).toContainText("22.0 s");
  await expect(result.locator("[data-part=overCap]")).toContainText("5.0 s");
  await expect(result.locator("[data-part=shortOfTarget]")).toContainText("0.0 s");
  // The field home lists it as finished (with its result), not as open.
  const runId = new URL(page.url()).searchParams.get("id");
  await page.goto("/field").catch(() => null);
  const finished = page.locator(`a[href="/logbook/run?id=${runId}"]`);
  await settle(page, finished, 50);
  await expect(finished).toContainText("569.0 s");
  await expect(page.locator(`a[href="/field/run?id=${runId}"]`)).toHaveCount(0);
});

test("two lanes offline: two pilots, different flights, both exact (F3K.11.8 matching)", async ({ page, context }) => {
  await openSetUpOffline(page, context);
  await chooseTaskH(page, ["Kit Marsh", "Rowan Vale"]);
  await createAndStart(page);
  const a = "Lane 1 · Kit Marsh";
  const b = "Lane 2 · Rowan Vale";
  // Lane 1: 63.0, 239.0, 182.0, 90.0 → 569.0 s (F3K.11.8). Lane 2: 61.5, 120.0, 200.0, 150.3 →
  // longest to 240: 200.0; next to 180: 150.3; to 120: 120.0; to 60: 60 → 530.3 s.
  await fly(page, [
    [a, 1_000, "Launch"], // A 1.0
    [b, 1_000, "Launch"], // B 2.0
    [b, 61_500, "Landed"], // B 63.5 → 61.5
    [a, 500, "Landed"], // A 64.0 → 63.0
    [a, 300, "Launch"], // A 64.3
    [b, 200, "Launch"], // B 64.5
    [b, 120_000, "Landed"], // B 184.5 → 120.0
    [b, 500, "Launch"], // B 185.0
  ]);
  await page.reload().catch(() => null); // both lanes in the air
  const spent = await settle(page, page.getByTestId("working-time-left"), 1);
  await fly(page, [
    [a, 118_300 - spent, "Landed"], // A 303.3 → 239.0
    [a, 300, "Launch"], // A 303.6
    [b, 81_400, "Landed"], // B 385.0 → 200.0
    [b, 1_000, "Launch"], // B 386.0
    [a, 99_600, "Landed"], // A 485.6 → 182.0
    [a, 300, "Launch"], // A 485.9
    [b, 50_400, "Landed"], // B 536.3 → 150.3
    [a, 39_600, "Landed"], // A 575.9 → 90.0
  ]);
  await expect(page.getByTestId("result-0")).toHaveText("569.0");
  await expect(page.getByTestId("result-1")).toHaveText("530.3");
  await page.clock.runFor(60_000);
  await press(page, page.getByRole("button", { name: "Close the window and see the result" }));
  await expect(page.getByTestId("final-result-0")).toHaveText("569.0 s");
  await expect(page.getByTestId("final-result-1")).toHaveText("530.3 s");
});

test("the working-time clock does not drift over a full window", async ({ page, context }) => {
  await openSetUpOffline(page, context);
  await chooseTaskH(page);
  const spent = await createAndStart(page);
  const left = page.getByTestId("working-time-left");
  const label = page.getByRole("region", { name: "Working time" });
  // Minute by minute, each reading exact (rounded up to the whole second left).
  for (let minute = 1; minute <= 9; minute++) {
    await page.clock.runFor(minute === 1 ? 60_000 - spent : 60_000);
    await redraw(page);
    await expect(left).toHaveText(`${10 - minute}:00`);
  }
  await page.clock.runFor(59_999); // 599.999 s: one millisecond of working time left
  await redraw(page);
  await expect(left).toHaveText("0:01");
  await expect(label).toContainText("Working time left");
  await page.clock.runFor(1); // exactly 600.000 s: working time is over, the landing window runs
  await redraw(page);
  await expect(left).toHaveText("0:30");
  await expect(label).toContainText("Landing window");
});

test("the recorded launch time is the input event's own timestamp", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com" });
  await chooseTaskH(page);
  // No controlled clock here (settle would install one): the page keeps the browser's own
  // performance.now, the clock event.timeStamp is on, so the app must store that stamp itself.
  await page.getByRole("button", { name: "Set up the window" }).click();
  await press(page, page.getByRole("button", { name: "Start working time" }));
  await expect(page.getByTestId("working-time-left")).toBeVisible();
  expect(await page.evaluate(() => /\[native code\]/.test(Function.prototype.toString.call(performance.now)))).toBe(true);
  await page.evaluate(() => {
    const w = window as unknown as { seen: number[] };
    w.seen = [];
    document.addEventListener("pointerdown", (e) => w.seen.push(e.timeStamp), { capture: true });
  });
  const me = (await page.getByRole("button", { name: /^Launch, / }).getAttribute("aria-label"))!.replace(/^Launch, /, "");
  await tap(page, me, "Launch");
  const runId = new URL(page.url()).searchParams.get("id");
  const seen = await page.evaluate(() => (window as unknown as { seen: number[] }).seen);
  const stored = (await storedEvents(page, runId!)).filter((e) => e.body.kind === "launch").map((e) => e.stamp.monoMs);
  expect(seen).toHaveLength(1);
  expect(stored).toEqual(seen);
});

test("a flight's launch is corrected on its own and the landing stays; a launch after the landing is refused", async ({ page, context }) => {
  await openSetUpOffline(page, context);
  await chooseTaskH(page);
  const spent = await createAndStart(page);
  const me = (await page.getByRole("button", { name: /^Launch, / }).getAttribute("aria-label"))!.replace(/^Launch, /, "");
  await fly(page, [
    [me, 10_000 - spent, "Launch"], // 10.0 s into the working time
    [me, 70_000, "Landed"], // 80.0 → 70.0 s
  ]);
  const flights = page.getByRole("list", { name: `Flights, ${me}` });
  await expect(flights).toContainText("70.0 s");
  await page.getByRole("button", { name: "Fix flight 1" }).click();
  const launchAt = page.getByLabel("Launch of flight 1, working time elapsed (m:ss.s)");
  await expect(launchAt).toHaveValue("0:10.0");
  if (process.env.SHOTS) await page.screenshot({ path: "/tmp/flight-fix.png", fullPage: true });
  // The timekeeper saw the release 2.5 s after the tap: 80.0 − 12.5 = 67.5 s.
  await launchAt.fill("0:12.5");
  await page.getByRole("button", { name: "Set launch" }).click();
  await expect(flights).toContainText("67.5 s");
  // H matches a flight to whichever target scores best (F3K.11.8): 67.5 s all counts against 2, 3 or 4 min.
  await expect(page.getByTestId("result-0")).toHaveText("67.5");
  // A launch typed after its own landing would pair the flights differently: refused, nothing changes.
  await page.getByRole("button", { name: "Fix flight 1" }).click();
  await launchAt.fill("1:30.0");
  await page.getByRole("button", { name: "Set launch" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "The launch must come before this flight's landing." })).toBeVisible();
  await expect(flights).toContainText("67.5 s");
  // Both the tap and its correction are kept (nothing overwritten): one launch, one correct event.
  const runId = new URL(page.url()).searchParams.get("id");
  const kinds = (await storedEvents(page, runId!)).map((e) => e.body.kind);
  expect(kinds.filter((k) => k === "launch")).toHaveLength(1);
  expect(kinds.filter((k) => k === "correct")).toHaveLength(1);
});

test("a wall-clock jump during a flight shows on the live lane, both times in plain words, while the window runs", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com", t0: T0 });
  await chooseTaskH(page);
  const spent = await createAndStart(page);
  const me = (await page.getByRole("button", { name: /^Launch, / }).getAttribute("aria-label"))!.replace(/^Launch, /, "");
  await fly(page, [[me, 10_000 - spent, "Launch"]]);
  await expect(page.getByTestId("clock-note-0")).toHaveCount(0);
  // Mid-flight the phone's wall clock is set back 5 minutes (a time sync); its steady clock runs on.
  await page.clock.setSystemTime((await page.evaluate(() => Date.now())) - 300_000);
  await fly(page, [[me, 60_000, "Landed"]]);
  const note = page.getByTestId("clock-note-0");
  await expect(note).toContainText("wall clock jumped");
  await expect(note).toContainText("Flight 1: 60.0 s by the phone's steady clock");
  await expect(note).toContainText("by its wall clock");
  await expect(page.getByTestId("result-0")).toHaveText("60.0"); // the steady clock's time counts
  await expect(page.getByTestId("working-time-left")).toBeVisible(); // still the live window
});

test("a clicker's Space and Enter drive the solo lane", async ({ page }) => {
  await openNewWindow(page, { email: "ada@example.com" });
  await chooseTaskH(page);
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page.getByRole("button", { name: "Start working time" })).toBeVisible();
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  await page.keyboard.press("Enter"); // the start signal
  const me = page.getByRole("button", { name: /^Launch, / });
  await expect(me).toBeVisible();
  await page.keyboard.press("Space");
  await expect(page.getByRole("button", { name: /^Landed, / })).toBeVisible();
  await expect(page.getByTestId("announcer")).toHaveText(/^Launch/);
  await page.keyboard.press("Enter");
  await expect(page.getByRole("button", { name: /^Launch, / })).toBeVisible();
  await expect(page.getByTestId("announcer")).toHaveText(/^Landed \d+\.\d s/);
});
