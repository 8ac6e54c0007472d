import { expect, test, type Page } from "@playwright/test";
import { signUpByApi } from "./support/api";
import { signInAs } from "./support/auth";
import { press } from "./support/field";

/**
 * The hangar and altimeter logs as a pilot uses them: add a model, fly a window with it, upload
 * the altimeter's CSV on the run page, see the launch heights there and on the model's page.
 * Real flights of ~10 s (the real clock): the log is made here from the instants of the presses.
 */
test.describe.configure({ timeout: 180_000 });
test.use({ viewport: { width: 390, height: 844 } });
const PASSWORD = "hangar-window-2026";
const HEIGHTS = [46, 63];

/** A 10 Hz log (seconds from `startMs`, metres): a 3 s zoom to each height, a glide down to the landing. */
function altimeterCsv(startMs: number, flights: { launch: number; land: number }[]): string {
  const rows = ["seconds,altitude_m"];
  const end = flights[flights.length - 1]!.land + 15_000;
  for (let t = startMs; t <= end; t += 100) {
    const i = flights.findIndex((f) => t >= f.launch && t < f.land);
    const f = flights[i];
    let h = 0;
    if (f) h = t <= f.launch + 3000 ? HEIGHTS[i]! * (1 - ((f.launch + 3000 - t) / 3000) ** 2) : HEIGHTS[i]! * (1 - (t - f.launch - 3000) / (f.land - f.launch - 3000));
    rows.push(`${((t - startMs) / 1000).toFixed(1)},${h.toFixed(1)}`);
  }
  return `${rows.join("\n")}\n`;
}

const localInput = (page: Page, ms: number) =>
  page.evaluate((ms) => {
    const d = new Date(ms);
    const p = (n: number) => String(n).padStart(2, "0");
    return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}T${p(d.getHours())}:${p(d.getMinutes())}:${p(d.getSeconds())}`;
  }, ms);

test("a pilot adds a model, flies a window with it, uploads a log and sees launch heights; another pilot gets 404", async ({ page, baseURL, browser }) => {
  const email = await signUpByApi(page.request, baseURL, "Hangar Pilot", "hangar", PASSWORD);
  await signInAs(page, email, PASSWORD);

  await page.goto("/hangar");
  await page.getByLabel("Name").fill("Test Heron");
  await page.getByLabel("Span (mm)").fill("1510");
  await page.getByLabel("Mass ready to fly (g)").fill("255");
  await expect(page.getByRole("status").filter({ hasText: "over the class limit of 1500 mm" })).toBeVisible(); // a caution, not a block
  await page.getByRole("button", { name: "Add to the hangar" }).click();
  await expect(page.getByRole("heading", { name: "Test Heron" })).toBeVisible();
  const modelUrl = page.url();

  await page.goto("/field/new");
  await expect(page.getByRole("button", { name: "Set up the window" })).toBeEnabled();
  await page.getByLabel("Field").fill("Hangar Meadow");
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const runId = new URL(page.url()).searchParams.get("id")!;
  await press(page, page.getByRole("button", { name: "Start working time" }));
  await page.getByLabel(/^Model/).selectOption({ label: "Test Heron" }); // the lane's model is chosen once the window runs
  const launch = page.getByRole("button", { name: /^Launch, / });
  const flights: { launch: number; land: number }[] = [];
  for (let i = 0; i < 2; i++) {
    const up = await press(page, launch);
    await page.waitForTimeout(10_000);
    const down = await press(page, page.getByRole("button", { name: /^Landed, / }));
    flights.push({ launch: (up.before + up.after) / 2, land: (down.before + down.after) / 2 });
    await page.waitForTimeout(3_000);
  }
  await page.getByText("End this window early").click();
  await page.getByRole("button", { name: "Close the window now" }).click();
  // the phone pushes the run; wait until the server has its end
  await expect.poll(async () => {
    const pull = (await (await page.request.get("/api/sync/pull?cursor=0")).json()) as { items: { type: string; data: { runId?: string; body?: { kind: string } } }[] };
    return pull.items.some((x) => x.type === "event" && x.data.runId === runId && x.data.body?.kind === "run-end");
  }, { timeout: 30_000 }).toBe(true);

  await page.goto(`/logbook/run?id=${runId}`);
  await page.getByText("Upload an altimeter log").click();
  await page.getByLabel("Logger").fill("Pocket logger");
  const startMs = Math.floor(flights[0]!.launch / 1000) * 1000 - 20_000;
  await page.getByLabel("CSV file (at most 5 MB)").setInputFiles({ name: "evening.csv", mimeType: "text/csv", buffer: Buffer.from(altimeterCsv(startMs, flights)) });
  await page.getByLabel("Log started at").fill(await localInput(page, startMs));
  await page.getByRole("button", { name: "Upload the log" }).click();
  await expect(page.getByRole("status").filter({ hasText: "2 launches found, 2 matched to flights" })).toBeVisible({ timeout: 20_000 });
  const heights = page.getByRole("list", { name: /^Launch heights, / });
  await expect(heights).toContainText(/Flight 1: 4[5-7]\.\d m/);
  await expect(heights).toContainText(/Flight 2: 6[2-4]\.\d m/);
  await expect(page.locator("[data-launch-height]")).toHaveCount(2); // labels on the strip

  await page.goto(modelUrl);
  await expect(page.getByTestId("model-flights")).toHaveText("2");
  await expect(page.getByTestId("model-best-launch")).toHaveText(/^6[2-4]\.\d m$/);

  const other = await browser.newContext({ baseURL });
  const otherPage = await other.newPage();
  const otherEmail = await signUpByApi(otherPage.request, baseURL, "Other Pilot", "hangar-other", PASSWORD);
  await signInAs(otherPage, otherEmail, PASSWORD);
  expect((await otherPage.goto(modelUrl))?.status()).toBe(404);
  expect((await otherPage.request.get(`/api/runs/${runId}/logs`)).status()).toBe(404);
  await otherPage.goto(`/logbook/run?id=${runId}`); // a static shell for offline use: the run is not on this phone, nor its heights
  await expect(otherPage.getByRole("heading", { name: "Run not found" })).toBeVisible();
  await other.close();
});
