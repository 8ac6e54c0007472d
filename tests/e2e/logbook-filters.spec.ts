import { expect, test, type Page } from "@playwright/test";
import { getCatalogueTask } from "../../lib/tasks";
import { signInAs } from "./support/auth";

/**
 * The logbook as a pilot or coach reads a season: each run row names its pilots, task and
 * field, and the list filters by pilot, task, field and date, kept in the address so a
 * filtered view can be shared. The phone's database is filled with invented runs with the
 * raw IndexedDB API (as logbook.spec.ts does); sync is cut off so nothing else arrives.
 */
test.use({ viewport: { width: 390, height: 844 }, serviceWorkers: "block" });

const ids = (n: number) => `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`;
const day = (d: number, h = 10) => Date.UTC(2026, 5, d, h, 0, 0);

function fixture() {
  const sessions = [
    { id: ids(701), ownerId: "e2e-pilot", fieldName: "Long Meadow", conditions: {}, startedAtWallMs: day(6) },
    { id: ids(702), ownerId: "e2e-pilot", fieldName: "Quarry Field", conditions: {}, startedAtWallMs: day(13) },
    { id: ids(703), ownerId: "e2e-pilot", fieldName: "Long Meadow", conditions: {}, startedAtWallMs: day(20) },
  ];
  const runs = [
    { id: ids(711), sessionId: ids(701), task: getCatalogueTask("H"), lanes: [{ lane: 0, pilotName: "Kit Marsh" }], createdAtWallMs: day(6, 11) },
    { id: ids(712), sessionId: ids(702), task: getCatalogueTask("B"), lanes: [{ lane: 0, pilotName: "Rowan Vale" }], createdAtWallMs: day(13, 11) },
    {
      id: ids(713),
      sessionId: ids(703),
      task: getCatalogueTask("B"),
      lanes: [{ lane: 0, pilotName: "Kit Marsh" }, { lane: 1, pilotName: "Sol Ardent" }],
      createdAtWallMs: day(20, 11),
    },
  ];
  return { sessions, runs };
}

async function storeFixture(page: Page) {
  await page.evaluate(async (data) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open("windowcall");
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const tx = db.transaction(["sessions", "runs"], "readwrite");
    for (const s of data.sessions) tx.objectStore("sessions").put(s);
    for (const r of data.runs) tx.objectStore("runs").put(r);
    await new Promise<void>((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
    });
    db.close();
  }, fixture());
}

test.beforeEach(async ({ page }) => {
  await page.route("**/api/sync/**", (route) => route.abort());
  await signInAs(page, "ada@example.com");
  await page.goto("/logbook");
  await expect(page.getByText("Nothing in the logbook on this phone yet.")).toBeVisible();
  await storeFixture(page);
  await page.reload();
});

const runRows = (page: Page) => page.getByRole("list", { name: "Runs" }).getByRole("listitem");

test("each run row names its pilots, task and field", async ({ page }) => {
  await expect(runRows(page)).toHaveCount(3);
  const newest = runRows(page).first();
  await expect(newest).toContainText("Kit Marsh");
  await expect(newest).toContainText("Sol Ardent");
  await expect(newest).toContainText("B · Next to last and last flight");
  await expect(newest).toContainText("Long Meadow");
  await expect(runRows(page).nth(1)).toContainText("Rowan Vale");
  await expect(runRows(page).nth(1)).toContainText("Quarry Field");
});

test("filters by pilot, task, field and date, kept in the address for sharing", async ({ page }) => {
  await page.getByLabel("Pilot").selectOption("Kit Marsh");
  await expect(page).toHaveURL(/[?&]pilot=Kit(\+|%20)Marsh/);
  await expect(runRows(page)).toHaveCount(2);
  await page.getByLabel("Task").selectOption("B");
  await expect(page).toHaveURL(/[?&]task=B/);
  await expect(runRows(page)).toHaveCount(1);
  await expect(runRows(page).first()).toContainText("Sol Ardent");

  // The address alone gives the same view (a shared link, or a reload).
  const shared = page.url();
  await page.goto("/logbook");
  await expect(runRows(page)).toHaveCount(3);
  await page.goto(shared);
  await expect(runRows(page)).toHaveCount(1);
  await expect(page.getByLabel("Pilot")).toHaveValue("Kit Marsh");
  await expect(page.getByLabel("Task")).toHaveValue("B");

  await page.goto("/logbook?field=Long+Meadow");
  await expect(runRows(page)).toHaveCount(2);
  await page.getByLabel("From").fill("2026-06-10");
  await expect(page).toHaveURL(/[?&]from=2026-06-10/);
  await expect(runRows(page)).toHaveCount(1);
  await expect(runRows(page).first()).toContainText("Sol Ardent");
  await page.getByLabel("To").fill("2026-06-19");
  await expect(runRows(page)).toHaveCount(0);
  await expect(page.getByText("No runs match these filters.")).toBeVisible();
  await page.getByRole("link", { name: "Clear the filters" }).click();
  await expect(runRows(page)).toHaveCount(3);
});
