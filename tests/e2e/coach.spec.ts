import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";
import { workerReady } from "./support/field";

/**
 * The Coach desk as its two users use it (db/seed: Mara coaches, Ada and Tobi grant her; Lena does
 * not): Lena offers her season to Mara's e-mail from Settings; Mara opens the Coach desk, finds
 * Lena on her roster and taps into Lena's Season, opens one of Lena's runs from it and writes a
 * note; Lena sees it on the run and answers, and Mara sees the answer; Mara assigns Lena a plan,
 * which Lena's Field shows as ready to fly and whose item sets up a window linked to it. Lena
 * revokes, and Mara's next request — the page and its route — is a 404, and after one sync Mara's
 * device database holds none of Lena's runs or notes. axe finds no serious violations on /coach
 * and /season.
 */

/** What the page's device databases hold of one pilot: runs with a lane of theirs, and notes about them. */
async function heldOf(page: Page, pilotId: string): Promise<{ runs: number; notes: number; names: string[] }> {
  return page.evaluate(async (pilotId) => {
    const names = (await indexedDB.databases()).map((d) => d.name ?? "").filter((n) => n.startsWith("windowcall"));
    let runs = 0;
    let notes = 0;
    for (const name of names) {
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const req = indexedDB.open(name);
        req.onsuccess = () => resolve(req.result);
        req.onerror = () => reject(req.error);
      });
      if (db.objectStoreNames.contains("runs")) {
        const all = await new Promise<{ lanes: { pilotUserId?: string }[] }[]>((resolve, reject) => {
          const req = db.transaction("runs").objectStore("runs").getAll();
          req.onsuccess = () => resolve(req.result);
          req.onerror = () => reject(req.error);
        });
        runs += all.filter((r) => r.lanes.some((l) => l.pilotUserId === pilotId)).length;
        const row = await new Promise<{ value: { pilotId: string }[] } | undefined>((resolve, reject) => {
          const req = db.transaction("meta").objectStore("meta").get("notes");
          req.onsuccess = () => resolve(req.result);
          req.onerror = () => reject(req.error);
        });
        notes += (row?.value ?? []).filter((n) => n.pilotId === pilotId).length;
      }
      db.close();
    }
    return { runs, notes, names };
  }, pilotId);
}

test.use({ viewport: { width: 360, height: 800 } });

async function noSeriousViolations(page: Page, what: string) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${what}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

test("a pilot grants a coach; the coach reads her Season, writes a note she answers and assigns a plan her Field shows; after the revoke a 404 and nothing of hers on the coach's phone", async ({ browser }) => {
  test.setTimeout(240_000);
  const pilotContext = await browser.newContext();
  const coachContext = await browser.newContext();
  const pilot = await pilotContext.newPage();
  const coach = await coachContext.newPage();

  await signInAs(pilot, "lena@example.com");
  await pilot.goto("/settings");
  const coaches = pilot.getByRole("region", { name: "Coaches" });
  await expect(coaches.getByText("Only you see your season.")).toBeVisible();
  await coaches.getByLabel("Coach's e-mail").fill("mara@example.com");
  await coaches.getByRole("button", { name: "Offer my season" }).click();
  await expect(coaches.getByRole("status")).toContainText("Offered to mara@example.com");
  await expect(coaches.getByRole("listitem").filter({ hasText: "waiting for that coach" })).toHaveCount(1);

  await signInAs(coach, "mara@example.com");
  await coach.goto("/coach");
  const roster = coach.getByRole("table", { name: "Pilots who let you see their season" });
  await expect(roster.getByRole("link", { name: "Ada Fenwick" })).toBeVisible();
  await expect(roster.getByRole("link", { name: "Lena Strand" })).toBeVisible();
  await noSeriousViolations(coach, "/coach");
  await roster.getByRole("link", { name: "Lena Strand" }).click();
  await expect(coach.getByRole("heading", { name: "Season of Lena Strand" })).toBeVisible();
  const lenaId = new URL(coach.url()).searchParams.get("pilot")!;
  expect(lenaId).toMatch(/^[0-9a-f-]{36}$/);
  expect((await coach.request.get(`/api/pilots/${lenaId}/season`)).status()).toBe(200);
  await expect(coach.getByRole("table").last()).toBeVisible();
  await noSeriousViolations(coach, "/season?pilot=");

  // a run of Lena's from her Season: Mara writes a note on it (the page reads the run from Mara's phone after its sync)
  const runLink = coach.locator('a[href^="/logbook/run?id="]').first();
  await expect(runLink).toBeVisible();
  const runHref = (await runLink.getAttribute("href"))!;
  await coach.goto(runHref);
  const notes = coach.getByRole("region", { name: "Coach notes" });
  await expect(notes).toBeVisible({ timeout: 60_000 });
  const noteText = "Land facing the spot and relaunch within three seconds.";
  await notes.getByLabel("A note for Lena Strand on this run").fill(noteText);
  await notes.getByRole("button", { name: "Send the note" }).click();
  await expect(notes.getByText(noteText)).toBeVisible();

  // Lena sees it on the same run and answers
  await pilot.goto(runHref);
  const pilotNotes = pilot.getByRole("region", { name: "Coach notes" });
  await expect(pilotNotes.getByText(noteText)).toBeVisible({ timeout: 60_000 });
  await expect(pilotNotes.getByText(/Mara Lindqvist · .* · on this run/)).toBeVisible();
  const answerText = "Will do: I'll practise the catch on Saturday.";
  await pilotNotes.getByLabel("Your answer").fill(answerText);
  await pilotNotes.getByRole("button", { name: "Send the answer" }).click();
  await expect(pilotNotes.getByText(answerText)).toBeVisible();

  // Mara sees the answer after her next sync
  await coach.reload();
  await expect(coach.getByRole("region", { name: "Coach notes" }).getByText(answerText)).toBeVisible({ timeout: 60_000 });

  // Mara assigns Lena a plan from the Coach desk
  await coach.goto("/coach");
  await coach.getByText("Build a plan").click();
  await coach.getByLabel("Pilot", { exact: true }).selectOption({ label: "Lena Strand" });
  await coach.getByLabel("Plan title").fill("Relaunch drills");
  await coach.getByLabel("Task", { exact: true }).selectOption("H:600");
  await coach.getByLabel("Goal in words").fill("one 1-2-3-4 window, median turnaround under 4 s");
  await coach.getByLabel("Windows to fly").fill("1");
  await coach.getByLabel("Seconds to beat").fill("4");
  await coach.getByRole("button", { name: "Assign the plan" }).click();
  await expect(coach.getByText("Plan assigned")).toBeVisible();
  await expect(coach.getByRole("article", { name: "Relaunch drills for Lena Strand" })).toContainText("0 of 1 window flown");
  await expect(roster.getByRole("link", { name: "Relaunch drills" })).toBeVisible();

  // it is on Lena's Field, ready to fly; its item sets up a window of its task, linked to it
  await pilot.goto("/field");
  const ready = pilot.getByRole("region", { name: "Ready to fly: plans from your coach" });
  await expect(ready.getByRole("article", { name: "Relaunch drills" })).toBeVisible({ timeout: 60_000 });
  await ready.getByRole("link", { name: /Task H \(10 min\): one 1-2-3-4 window/ }).click();
  await expect(pilot.getByTestId("coach-plan-item")).toContainText("From Mara Lindqvist's plan “Relaunch drills”");
  await expect(pilot.getByRole("button", { name: "Set up the window" })).toBeEnabled();
  const fieldName = pilot.getByLabel("Field", { exact: true });
  if (!(await fieldName.inputValue())) await fieldName.fill("Five Acre Meadow");
  await pilot.getByRole("button", { name: "Set up the window" }).click();
  await pilot.waitForURL(/\/field\/run\?id=/);
  const newRunId = new URL(pilot.url()).searchParams.get("id")!;
  const linked = await pilot.evaluate(async (id) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open("windowcall");
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const run = await new Promise<{ task: { letter: string }; plan?: { item: number } }>((resolve, reject) => {
      const req = db.transaction("runs").objectStore("runs").get(id);
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    db.close();
    return { letter: run.task.letter, item: run.plan?.item };
  }, newRunId);
  expect(linked).toEqual({ letter: "H", item: 0 });

  // before the revoke, Mara's phone holds Lena's runs and notes (so what follows can fail)
  await coach.goto("/coach");
  await expect.poll(async () => (await heldOf(coach, lenaId)).notes, { timeout: 30_000 }).toBeGreaterThan(0);
  expect((await heldOf(coach, lenaId)).runs).toBeGreaterThan(0);

  await pilot.goto("/settings");
  await coaches.getByRole("button", { name: "Revoke Mara Lindqvist" }).click();
  await expect(coaches.getByRole("status")).toContainText("Revoked");
  await expect(coaches.getByText("Only you see your season.")).toBeVisible();

  expect((await coach.request.get(`/api/pilots/${lenaId}/season`)).status()).toBe(404);
  const page = await coach.goto(`/season?pilot=${lenaId}`);
  expect(page?.status()).toBe(404);
  await coach.goto("/coach");
  await expect(roster.getByRole("link", { name: "Ada Fenwick" })).toBeVisible();
  await expect(roster.getByRole("link", { name: "Lena Strand" })).toHaveCount(0);
  // one sync later (this page's), Mara's phone holds nothing of Lena's
  await expect.poll(async () => heldOf(coach, lenaId), { timeout: 60_000 }).toMatchObject({ runs: 0, notes: 0 });

  await pilotContext.close();
  await coachContext.close();
});

/** The run `id` as the page's device database holds it: its task letter and plan link. */
async function storedRun(page: Page, id: string): Promise<{ letter: string; plan?: { id: string; item: number } }> {
  return page.evaluate(async (id) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open("windowcall");
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const run = await new Promise<{ task: { letter: string }; plan?: { id: string; item: number } }>((resolve, reject) => {
      const req = db.transaction("runs").objectStore("runs").get(id);
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    db.close();
    return { letter: run.task.letter, plan: run.plan };
  }, id);
}

test("a plan's next item starts in one tap on the pilot's Field; the coach sees its progress as of the pilot's last sync, edits and closes it; offline the coach desk and the pilot's list of coaches show their last data and age", async ({ browser, baseURL }) => {
  test.setTimeout(240_000);
  const pilotContext = await browser.newContext();
  const coachContext = await browser.newContext();
  const pilot = await pilotContext.newPage();
  const coach = await coachContext.newPage();

  // Mara assigns Tobi (who grants her his season in the demo) a two-item plan
  await signInAs(coach, "mara@example.com");
  const roster = (await (await coach.request.get("/api/coach/pilots")).json()) as { pilots: { pilotId: string; name: string }[] };
  const tobiId = roster.pilots.find((p) => p.name === "Tobi Okafor")!.pilotId;
  const made = await coach.request.post("/api/coach/plans", {
    headers: sameOrigin(baseURL),
    data: { pilotId: tobiId, title: "Tobi's launch week", items: [
      { letter: "B", variant: 420, goal: "two windows of two flights, median turnaround under 5 s", windows: 2, measure: { kind: "median-turnaround-below", seconds: 5 } },
      { letter: "A", variant: 600, goal: "one last-flight window", windows: 1, measure: null },
    ] },
  });
  expect(made.status()).toBe(201);
  const planId = ((await made.json()) as { plan: { id: string } }).plan.id;

  // Tobi's phone has set up a window at a field before (the form remembers it); one tap starts the plan's next item
  await signInAs(pilot, "tobi@example.com");
  await pilot.goto("/field");
  await pilot.evaluate(() => localStorage.setItem("windowcall.field.last-field", "Five Acre Meadow"));
  const ready = pilot.getByRole("region", { name: "Ready to fly: plans from your coach" });
  const card = ready.getByRole("article", { name: "Tobi's launch week" });
  await expect(card).toBeVisible({ timeout: 60_000 });
  await card.getByRole("button", { name: "Start next: Task B (7 min)" }).click();
  await pilot.waitForURL(/\/field\/run\?id=/);
  const runId = new URL(pilot.url()).searchParams.get("id")!;
  expect(await storedRun(pilot, runId)).toEqual({ letter: "B", plan: { id: planId, item: 0 } });

  // the run reaches the server with its link (Tobi's sync), and Mara reads the plan's progress as of that sync
  await expect.poll(async () => {
    const res = await coach.request.get("/api/coach/plans");
    const plan = ((await res.json()) as { plans: { id: string; pilotSyncedAtMs: number | null }[] }).plans.find((p) => p.id === planId);
    return plan?.pilotSyncedAtMs ?? null;
  }, { timeout: 60_000 }).not.toBeNull();
  await coach.goto("/coach");
  const article = coach.getByRole("article", { name: "Tobi's launch week for Tobi Okafor" });
  await expect(article.getByTestId("plan-as-of")).toHaveText(/^Progress as of Tobi Okafor's last sync, (less than a minute|\d+ minutes?) ago\.$/);
  await noSeriousViolations(coach, "/coach with plans");

  // Mara edits the title and closes the plan
  const item = coach.locator(`#plan-${planId}`);
  await item.getByText("Edit “Tobi's launch week”").click();
  await item.getByLabel("Plan title").fill("Tobi's launch week, shorter");
  await item.getByRole("button", { name: "Save the changes" }).click();
  await expect(item.getByText("Plan changed")).toBeVisible();
  const renamed = coach.getByRole("article", { name: "Tobi's launch week, shorter for Tobi Okafor" });
  await expect(renamed).toBeVisible();
  await item.getByRole("button", { name: "Close “Tobi's launch week, shorter”" }).click();
  await expect(renamed).toContainText("For Tobi Okafor · closed");
  await expect(item.getByRole("button", { name: "Reopen “Tobi's launch week, shorter”" })).toBeVisible();

  // after Tobi's next sync it is no longer ready to fly: closed, with nothing to start
  // each load pulls once its page has settled (components/sync/when-settled.ts): give every load that long
  const closedList = ready.getByText("Finished or closed plans (");
  await expect.poll(async () => {
    await pilot.goto("/field");
    await closedList.waitFor({ timeout: 10_000 }).catch(() => undefined);
    return closedList.count();
  }, { timeout: 60_000 }).toBeGreaterThan(0);
  await expect(ready.getByRole("article", { name: "Tobi's launch week, shorter" })).toBeHidden();
  await ready.getByText("Finished or closed plans (").click();
  const closedCard = ready.getByRole("article", { name: "Tobi's launch week, shorter" });
  await expect(closedCard).toContainText("closed by your coach");
  await expect(closedCard.getByRole("button", { name: /^Start next/ })).toHaveCount(0);

  // offline, Mara's coach desk shows the roster and plans it last fetched, and says how old they are
  await coach.goto("/coach");
  await workerReady(coach);
  await coach.reload(); // a controlled load puts the page in the worker's cache
  await expect(coach.getByRole("table", { name: "Pilots who let you see their season" })).toBeVisible();
  await coachContext.setOffline(true);
  await coach.reload().catch(() => null);
  await expect(coach.getByRole("table", { name: "Pilots who let you see their season" }).getByRole("link", { name: "Tobi Okafor" })).toBeVisible();
  await expect(coach.getByText(/^Offline — showing the last roster fetched, from (less than a minute|\d+ minutes?) ago\.$/)).toBeVisible();
  await expect(coach.getByText(/^Offline — showing the last plans fetched/)).toBeVisible();
  await expect(coach.getByRole("article", { name: "Tobi's launch week, shorter for Tobi Okafor" })).toBeVisible();
  await coachContext.setOffline(false);

  // offline, Tobi's Settings list who can see his season as this phone last fetched it, and say how old that list is
  await pilot.goto("/settings");
  const coaches = pilot.getByRole("region", { name: "Coaches" });
  await expect(coaches.getByRole("button", { name: "Revoke Mara Lindqvist" })).toBeVisible();
  await workerReady(pilot);
  await pilotContext.setOffline(true);
  await pilot.reload().catch(() => null);
  await expect(coaches.getByText(/^Offline — showing the last list of coaches fetched, from (less than a minute|\d+ minutes?) ago\.$/)).toBeVisible();
  await expect(coaches.getByText(/^Mara Lindqvist \(mara@example\.com\) sees your season/)).toBeVisible();
  await pilotContext.setOffline(false);

  await pilotContext.close();
  await coachContext.close();
});
