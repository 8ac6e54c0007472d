import { expect, type Locator, type Page } from "@playwright/test";
import { signInAs } from "./auth";

/** Waits until the service worker is active and controls the page (so it may go offline). */
export async function workerReady(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((resolve) => navigator.serviceWorker.addEventListener("controllerchange", resolve, { once: true }));
    }
  });
}

/**
 * A trusted press (pointerdown, then up) in the middle of the control, as a finger gives it;
 * returns the real time just before and after the pointerdown.
 */
export async function press(page: Page, target: Locator): Promise<{ before: number; after: number }> {
  await target.evaluate((el) => el.scrollIntoView({ block: "center" }));
  const box = await target.boundingBox();
  if (!box) throw new Error("control not on screen");
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  const before = Date.now();
  await page.mouse.down();
  const after = Date.now();
  await page.mouse.up();
  return { before, after };
}

/**
 * Lets a freshly loaded page run its timers on Playwright's paused clock until `target` shows;
 * returns the fake ms that took.
 */
export async function settle(page: Page, target: Locator, stepMs = 16): Promise<number> {
  for (let spent = 0; spent < 5_000; spent += stepMs) {
    if (await target.isVisible()) return spent;
    await page.clock.runFor(stepMs);
  }
  throw new Error("the page did not settle");
}

/** A stored event as the page's device database holds it (the fields these tests read). */
export type StoredEvent = { runId: string; body: { kind: string }; stamp: { monoMs: number } };

/**
 * The run's events as the phone stored them, read with the raw IndexedDB API (no test-only
 * path in the app). The first account to sign in on a browser uses the base database name.
 */
export async function storedEvents(page: Page, runId: string): Promise<StoredEvent[]> {
  return page.evaluate(async (runId) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open("windowcall");
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const all = await new Promise<StoredEvent[]>((resolve, reject) => {
      const req = db.transaction("events").objectStore("events").getAll();
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    db.close();
    return all.filter((e) => e.runId === runId);
  }, runId);
}

/** How a spec opens the new-window form (openNewWindow). */
export type OpenNewWindow = {
  /** Sign in as this account first; leave out when the page is already signed in. */
  email?: string;
  /** Fix the page's clock here; it then stands still an hour later until the spec moves it. Leave out for the real clock. */
  t0?: Date;
  /** Name the field; leave out to let the spec fill it (or to leave it empty on purpose). */
  field?: string;
  /** Runs after signing in, before the clock and the form: e.g. wait for the worker and go offline. */
  beforeForm?: () => Promise<void>;
  /** The network is cut: the form comes from the worker's precache, so the navigation itself may report a failure. */
  offline?: boolean;
  /** Fake ms to let pass once the form is up, before the clock is paused (timers run once). */
  warmUpMs?: number;
};

/**
 * Signs in, fixes the page's clock at `t0`, opens the new-window form, waits until it can be
 * used and names the field. The spec chooses the rest.
 */
export async function openNewWindow(page: Page, { email, t0, field, beforeForm, offline, warmUpMs }: OpenNewWindow): Promise<void> {
  if (email) await signInAs(page, email);
  await beforeForm?.();
  if (t0) await page.clock.install({ time: t0 });
  const opened = page.goto("/field/new");
  await (offline ? opened.catch(() => null) : opened);
  await expect(page.getByRole("heading", { name: "New task window" })).toBeVisible();
  if (t0 && warmUpMs) await page.clock.runFor(warmUpMs);
  await expect(page.getByRole("button", { name: "Set up the window" })).toBeEnabled();
  if (t0) await page.clock.pauseAt(new Date(t0.getTime() + 3_600_000));
  if (field !== undefined) await page.getByLabel("Field", { exact: true }).fill(field);
}
