import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { readFile } from "node:fs/promises";
import Papa from "papaparse";
import pg from "pg";
import { signInAs } from "./support/auth";

/**
 * The demo pilot's Season (db/seed: a season of practice at Five Acre Meadow, March to November
 * 2026, and one club contest): every chart drawn, filters by task and date in the address, the
 * runs table sorted on the server, the runs CSV equal to the database's rows, the model filter's
 * launch heights equal to the database's, and axe clean.
 */

const CHARTS = ["share", "turnaround", "targets", "durations", "launches", "lost", "height-week", "height-time"];

const runRows = (page: Page) => page.locator("#season-runs tbody tr");

async function seconds(page: Page, column: number): Promise<number[]> {
  const cells = await runRows(page).locator(`td:nth-child(${column})`).allInnerTexts();
  return cells.map((c) => Number.parseFloat(c));
}

/** Ada's own runs of task N from April to September 2026 (six in the seed), straight from the database: id, day, result in seconds. */
async function adasRunsInDatabase(): Promise<string[][]> {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const res = await db.query<{ id: string; at: Date; result_tenths: number; field_name: string }>(`
      select r.id, r.created_at as at, l.result_tenths, s.field_name
      from run_lanes l join runs r on r.id = l.run_id join field_sessions s on s.id = r.session_id join users u on u.id = l.pilot_user_id
      where u.email = 'ada@example.com' and r.created_by = u.id and l.result_tenths is not null
        and r.task_code = 'N' and r.created_at >= '2026-04-01T00:00:00Z' and r.created_at < '2026-10-01T00:00:00Z'`);
    return res.rows.map((r) => [r.id, r.at.toISOString().replace("Z", "+00:00"), "N", r.field_name, (r.result_tenths / 10).toFixed(1)]).sort();
  } finally {
    await db.end();
  }
}

test("the demo pilot reads their season: charts, filters, sorting, the CSV", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Season" }).click();
  await expect(page.getByRole("heading", { name: "Season", level: 1 })).toBeVisible();

  for (const id of CHARTS) {
    const figure = page.locator(`figure[data-chart="${id}"]`);
    await expect(figure.locator("svg.recharts-surface").first(), `chart ${id}`).toBeVisible();
    await expect(figure.locator("figcaption")).not.toBeEmpty();
    await figure.getByText(/^Table view/).click();
    await expect(figure.locator("tbody tr").first()).toBeVisible();
  }
  await expect(page.getByText("Personal bests")).toBeVisible();

  await page.getByLabel("Task", { exact: true }).selectOption("N");
  await expect(page).toHaveURL(/task=N/);
  await page.getByLabel("From", { exact: true }).fill("2026-04-01");
  await page.getByLabel("To", { exact: true }).fill("2026-09-30");
  await expect(page).toHaveURL(/from=2026-04-01/);
  await expect(page).toHaveURL(/to=2026-09-30/);
  await expect(runRows(page).first()).toBeVisible();
  await expect(runRows(page).locator("td:nth-child(2)").filter({ hasNotText: "Task N" })).toHaveCount(0);
  const expected = await adasRunsInDatabase();
  expect(expected.length).toBeGreaterThan(1);
  await expect(page.locator("#season-runs-title ~ div").getByText(`${expected.length} runs`)).toBeVisible();

  await page.locator("#season-runs").getByRole("button", { name: "Result" }).click();
  const header = page.locator("#season-runs th").filter({ hasText: "Result" });
  await expect(header).toHaveAttribute("aria-sort", /ascending|descending/);
  const direction = await header.getAttribute("aria-sort");
  await expect(async () => {
    const shown = await seconds(page, 4);
    const sorted = [...shown].sort((a, b) => (direction === "ascending" ? a - b : b - a));
    expect(shown).toEqual(sorted);
    expect(shown.length).toBe(Math.min(10, expected.length));
  }).toPass();

  const downloading = page.waitForEvent("download");
  await page.getByRole("link", { name: "Runs as CSV" }).click();
  const download = await downloading;
  const parsed = Papa.parse<Record<string, string>>(await readFile((await download.path())!, "utf8"), { header: true, skipEmptyLines: true });
  const fromFile = parsed.data.map((r) => [r.run_id!, r.date!, r.task!, r.field!, r.result_s!]).sort();
  expect(fromFile).toEqual(expected);

  await runRows(page).first().getByRole("link").click();
  await expect(page).toHaveURL(/\/logbook\/run\?id=/);
});

/** How many matched launch heights Ada's own windows flown with Blue Tern have (the seed's logs), straight from the database. */
async function ternLaunchesInDatabase(): Promise<number> {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const res = await db.query<{ n: number }>(`
      select count(*)::int as n from launch_heights h join models m on m.id = h.model_id join users u on u.id = m.owner_id
      join run_lanes l on l.run_id = h.run_id and l.lane = h.lane join runs r on r.id = h.run_id
      where u.email = 'ada@example.com' and m.name = 'Blue Tern' and h.flight_index is not null
        and l.pilot_user_id = u.id and r.created_by = u.id and l.result_tenths is not null`);
    return res.rows[0]!.n;
  } finally {
    await db.end();
  }
}

test("the model filter narrows the launch heights to the model's launches", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/season");
  const overTime = page.locator('figure[data-chart="height-week"]');
  await expect(overTime.locator("svg.recharts-surface").first()).toBeVisible();
  const n = await ternLaunchesInDatabase();
  expect(n).toBeGreaterThan(5);
  await page.getByLabel("Model", { exact: true }).selectOption({ label: "Blue Tern" });
  await expect(page).toHaveURL(/[?&]model=[0-9a-f-]{36}/);
  await expect(overTime.locator("figcaption")).toContainText(`over ${n} launches`);
  await overTime.getByText(/^Table view/).click();
  const launches = (await overTime.locator("tbody tr td:nth-child(2)").allInnerTexts()).map(Number);
  expect(launches.reduce((a, b) => a + b, 0)).toBe(n);
});

test("Season has no serious accessibility violations", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.goto("/season");
  for (const id of CHARTS) await expect(page.locator(`figure[data-chart="${id}"] svg.recharts-surface`).first()).toBeVisible();
  await expect(runRows(page).first()).toBeVisible();
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
});
