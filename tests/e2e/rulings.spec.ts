import { expect, test, type Page } from "@playwright/test";
import { openNewWindow, press, settle } from "./support/field";

/**
 * Rulings at the field as a timekeeper records them, and how the run shows them: penalties
 * applied or dropped with the reason (F3K.4.3), a result not signed (F3K.1.2), a re-flight
 * (F3K.9.6); and the scoring choices set up with the window, stored with the run.
 */
const T0 = new Date("2026-05-03T09:00:00Z");
test.use({ viewport: { width: 390, height: 844 } });
test.describe.configure({ timeout: 150_000 });

const A = "Lane 1 · Kit Marsh";
const B = "Lane 2 · Rowan Vale";

async function setUp(page: Page, task: RegExp, lanes: string[]) {
  await openNewWindow(page, { email: "tobi@example.com", t0: T0, field: "North Meadow" });
  if (lanes.length > 0) {
    await page.getByRole("radio", { name: /Several pilots/ }).check();
    for (const [i, name] of lanes.entries()) await page.getByLabel(`Pilot in lane ${i + 1}`).fill(name);
  }
  await page.getByRole("radio", { name: task }).check();
}

async function start(page: Page) {
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  const go = page.getByRole("button", { name: "Start working time" });
  await settle(page, go);
  await press(page, go);
  await settle(page, page.getByTestId("working-time-left"), 1);
}

async function tap(page: Page, lane: string, from: "Launch" | "Landed") {
  await press(page, page.getByRole("button", { name: `${from}, ${lane}` }));
  await expect(page.getByRole("button", { name: `${from === "Launch" ? "Landed" : "Launch"}, ${lane}` })).toBeVisible();
}

/** Opens the lane's penalty panel, picks what happened (and mid-air), adds it. */
async function penalty(page: Page, lane: string, what: string, midAir = false) {
  await page.getByRole("button", { name: `Penalty… ${lane}` }).click();
  const form = page.getByRole("form", { name: `Penalty, ${lane}` });
  await form.getByLabel("What happened").selectOption({ label: what });
  await expect(form.getByLabel("In which flight")).toHaveValue(/.+/); // the lane's last flight
  if (midAir) await form.getByLabel(/mid-air collision/).check();
  await form.getByRole("button", { name: "Add penalty" }).click();
  await expect(form).toBeHidden();
}

test("penalties of one flight, a mid-air contact, an unsigned result and a re-flight, as the run shows them", async ({ page }) => {
  await setUp(page, /^G · Five longest flights/, ["Kit Marsh", "Rowan Vale"]);
  // Our choice for exact halves, kept with the window.
  await page.getByText("Scoring choices the rules leave open").click();
  await page.getByLabel(/an exact half of 0.1 point/).selectOption({ label: "Exact halves round to even" });
  await start(page);
  await page.clock.runFor(1_000);
  await tap(page, A, "Launch");
  await page.clock.runFor(1_000);
  await tap(page, B, "Launch");
  await page.clock.runFor(48_000);
  await tap(page, B, "Landed"); // 48.0 s
  await page.clock.runFor(11_000);
  await tap(page, A, "Landed"); // 60.0 s
  await expect(page.getByTestId("result-0")).toHaveText("60.0");

  // Lane 1, flight 1: −100 then −300 in the same flight, and a contact caused by a mid-air collision.
  await penalty(page, A, "Model touched an object or the ground in a safety area");
  await penalty(page, A, "Model touched a person in a safety area");
  await penalty(page, A, "Model touched an object or the ground in a safety area", true);
  // Lane 2: the result is not signed, and the pilot is granted a re-flight for rain.
  await page.getByRole("button", { name: `Penalty… ${B}` }).click();
  await page.getByRole("button", { name: new RegExp(`^Result not signed: round scores zero ?, ${B}$`) }).click();
  await page.getByRole("button", { name: `Penalty… ${B}` }).click();
  const reflight = page.getByRole("form", { name: `Re-flight, ${B}` });
  await reflight.getByLabel("Re-flight because of").selectOption({ label: "rain" });
  await reflight.getByLabel("Flown").selectOption({ label: "in a new group of re-flyers" });
  await reflight.getByRole("button", { name: "Grant a re-flight" }).click();
  await expect(reflight).toBeHidden();

  await page.getByText("End this window early").click();
  await page.getByRole("button", { name: "Close the window now" }).click();
  await expect(page.getByTestId("final-result-0")).toHaveText("60.0 s");
  await expect(page.getByTestId("final-result-1")).toHaveText("0.0 s"); // F3K.1.2

  await page.getByRole("link", { name: /Full review in the logbook/ }).click();
  await expect(page).toHaveURL(/\/logbook\/run\?id=/);
  await settle(page, page.getByTestId("rule-settings")); // the page reads the run on the paused clock
  await expect(page.getByTestId("rule-settings")).toHaveText("Normalised scores: exact halves round to even");
  const penalties = page.getByRole("list", { name: "Penalties, Kit Marsh" }).getByRole("listitem");
  // F3K.4.3: only the highest of one flight counts; none for a mid-air collision.
  await expect(penalties).toHaveText([
    "−100 points · Model touched an object or the ground in a safety area · flight 1 — dropped: a higher penalty in the same flight counts instead (F3K.4.3)",
    "−300 points · Model touched a person in a safety area · flight 1 — applied",
    "−100 points · Model touched an object or the ground in a safety area · flight 1 — dropped: caused by a mid-air collision (F3K.4.3)",
  ]);
  await expect(page.getByRole("region", { name: "Rulings, Kit Marsh" })).toContainText("Penalty points that count: 300");
  await expect(page.getByTestId("lane-result-1")).toHaveText("0.0 s");
  await expect(page.getByTestId("round-zero-1")).toHaveText(
    "The round scores zero: the result was not signed by pilot and timekeeper (F3K.1.2). Flown: 48.0 s.",
  );
  await expect(page.getByTestId("reflight-1")).toHaveText(
    "Re-flight granted for rain, flown in a new group of re-flyers: the re-flight's result stands, even if worse (F3K.9.6).",
  );
  // Undone rulings would leave the audit trail; these stand and are listed there too.
  await expect(page.getByRole("list", { name: "Corrections" })).toContainText("The round result of Rowan Vale was not signed");
});

test("task E: the target picker is there before the launch and right after release, not later (F3K.11.5)", async ({ page }) => {
  await setUp(page, /^E · Poker \(variable target time\) · 10 min/, []);
  await page.getByText("Scoring choices the rules leave open").click();
  await page.getByLabel(/end of working time.* call credits/).selectOption({ label: "Its time only if still flying at the end" });
  await start(page);
  const picker = page.getByRole("group", { name: /^Announced target/ });
  await expect(picker).toBeVisible();
  await press(page, page.getByRole("button", { name: /^Launch, / }));
  await page.clock.runFor(3_000);
  await page.evaluate(() => document.dispatchEvent(new Event("visibilitychange")));
  await expect(picker).toBeVisible(); // shown right after release
  await page.clock.runFor(3_000);
  await page.evaluate(() => document.dispatchEvent(new Event("visibilitychange")));
  await expect(picker).toBeHidden(); // 6 s into the flight: too late to announce
  await press(page, page.getByRole("button", { name: /^Landed, / }));
  await page.getByText("End this window early").click();
  await page.getByRole("button", { name: "Close the window now" }).click();
  await page.getByRole("link", { name: /Full review in the logbook/ }).click();
  await settle(page, page.getByTestId("rule-settings"));
  await expect(page.getByTestId("rule-settings")).toHaveText(
    "Normalised scores: exact halves round up · End of working time call: its time only if still flying at the end",
  );
});

test("a club mate's \"not signed\" and re-flight at practice are shown on the run page as notes, not applied and not dropped", async ({ page }) => {
  // Ada times Tobi (a club mate with an account): she is neither an official nor the pilot, so her rulings do not count.
  await openNewWindow(page, { email: "ada@example.com", field: "North Meadow" });
  await page.getByRole("radio", { name: /A partner/ }).check();
  await page.getByLabel("Partner's name").fill("tobi okafor");
  await expect(page.getByText("Club mate: the run goes to Tobi Okafor’s logbook too.")).toBeVisible();
  await page.getByRole("radio", { name: /^A · / }).first().check();
  await page.getByRole("button", { name: "Set up the window" }).click();
  await expect(page).toHaveURL(/\/field\/run\?id=/);
  await page.getByRole("button", { name: "Start working time" }).click();
  await page.getByRole("button", { name: "Launch, Tobi Okafor" }).click();
  await page.getByRole("button", { name: "Landed, Tobi Okafor" }).click();
  await page.getByRole("button", { name: "Penalty… Tobi Okafor" }).click();
  await page.getByRole("button", { name: /^Result not signed: round scores zero ?, Tobi Okafor$/ }).click();
  await page.getByRole("button", { name: "Penalty… Tobi Okafor" }).click();
  const reflight = page.getByRole("form", { name: "Re-flight, Tobi Okafor" });
  await reflight.getByLabel("Re-flight because of").selectOption({ label: "rain" });
  await reflight.getByRole("button", { name: "Grant a re-flight" }).click();
  await expect(reflight).toBeHidden();

  await page.goto(`/logbook/run?id=${new URL(page.url()).searchParams.get("id")}`);
  const notes = page.getByRole("list", { name: "Rulings not applied, Tobi Okafor" }).getByRole("listitem");
  await expect(notes).toHaveText([
    "Not applied: Ada Fenwick marked the result as not signed, which would score the round zero. Only a contest official’s ruling, or the pilot’s own on the record they timed, counts.",
    "Not applied: Ada Fenwick asked for a re-flight because of rain, in a later group. Only a contest official’s ruling, or the pilot’s own on the record they timed, counts.",
  ]);
  await expect(page.getByTestId("round-zero-0")).toHaveCount(0); // the round is not zeroed
  await expect(page.getByTestId("reflight-0")).toHaveCount(0);
});
